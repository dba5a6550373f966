import { Router } from 'express';
import { computeWorksheet } from '@biasproof/calc';
import { encodeResults, solveRequestSchema } from '@biasproof/shared';
import { requireUser } from '../auth/require-user.ts';
import type { Services } from '../services.ts';

/**
 * `/api/calc/…`: the engine for drafts that are not saved (signed-in people only). The body
 * size is capped where the app parses it (MAX_DRAFT_BYTES) and the circuit size by the schema.
 */
export function calcRoutes(svc: Services): Router {
  const router = Router();
  router.use(requireUser(svc.sequelize));
  router.post('/solve', (req, res) => {
    const draft = solveRequestSchema.parse(req.body);
    res.json(encodeResults(computeWorksheet(draft)));
  });
  return router;
}
