import { Router } from 'express';
import { notificationPreferencesSchema } from '@biasproof/shared';
import type { Services } from '../services.ts';
import { requireUser, signedInUser } from './require-user.ts';
import {
  getNotificationPreferences,
  setNotificationPreferences,
} from './notification-preferences.ts';

/** `/api/account/…`: the signed-in person's own settings (CSRF checked like every mutation). */
export function accountRoutes(svc: Services): Router {
  const router = Router();
  router.use(requireUser(svc.sequelize));
  router.get('/notifications', async (_req, res) => {
    res.json(await getNotificationPreferences(svc, signedInUser(res).id));
  });
  router.put('/notifications', async (req, res) => {
    const input = notificationPreferencesSchema.parse(req.body);
    res.json(await setNotificationPreferences(svc, signedInUser(res).id, input));
  });
  return router;
}
