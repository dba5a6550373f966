import { Router } from 'express';
import { rateLimit } from 'express-rate-limit';
import {
  changePasswordRequestSchema,
  passwordResetConfirmSchema,
  passwordResetRequestSchema,
  signInRequestSchema,
  updateProfileRequestSchema,
} from '@biasproof/shared';
import { AppError } from '../errors/app-error.ts';
import type { Services } from '../services.ts';
import type { Csrf } from './csrf.ts';
import { destroySession, SESSION_COOKIE, startSignedInSession } from './session.ts';
import { requireUser, signedInUser } from './require-user.ts';
import { auditSignOut, signIn } from './sign-in.ts';
import { changePassword, getMe, updateProfile } from './account.ts';
import { confirmPasswordReset, requestPasswordReset } from './password-reset.ts';

/** `/api/auth/…`: CSRF token, sign-in and out, the signed-in person, password change and reset. */
export function authRoutes(svc: Services, csrf: Csrf): Router {
  const router = Router();
  const signedIn = requireUser(svc.sequelize);

  router.get('/csrf', (req, res) => {
    // Storing the session keeps its id (which the token is bound to) stable between requests.
    req.session.startedAt ??= Date.now();
    res.json({ token: csrf.issueToken(req, res) });
  });

  router.post('/sign-in', async (req, res) => {
    const input = signInRequestSchema.parse(req.body);
    const userId = await signIn(svc, input, req.ip ?? 'unknown');
    await startSignedInSession(req, userId);
    // The old token was bound to the old session; hand the client the new session's token.
    res.setHeader('x-csrf-token', csrf.issueToken(req, res, { fresh: true }));
    res.json(await getMe(svc, userId));
  });

  router.post('/sign-out', async (req, res) => {
    const userId = req.session.userId;
    await destroySession(req);
    res.clearCookie(SESSION_COOKIE, { path: '/' });
    if (userId) await auditSignOut(svc, userId);
    res.status(204).end();
  });

  router.get('/me', signedIn, async (_req, res) => {
    res.json(await getMe(svc, signedInUser(res).id));
  });

  router.patch('/me', signedIn, async (req, res) => {
    const input = updateProfileRequestSchema.parse(req.body);
    res.json(await updateProfile(svc, signedInUser(res).id, input));
  });

  router.post('/me/password', signedIn, async (req, res) => {
    const input = changePasswordRequestSchema.parse(req.body);
    await changePassword(svc, signedInUser(res).id, req.sessionID, input);
    res.status(204).end();
  });

  router.post(
    '/password-reset',
    rateLimit({
      windowMs: 15 * 60 * 1000,
      limit: svc.config.passwordResetRequestsPerIp,
      standardHeaders: 'draft-8',
      legacyHeaders: false,
      handler: (_req, _res, next) =>
        next(new AppError('too-many-requests', 'Too many reset requests; try again later.')),
    }),
    async (req, res) => {
      const input = passwordResetRequestSchema.parse(req.body);
      await requestPasswordReset(svc, input);
      res
        .status(202)
        .json({ message: 'If the address has an account, a reset link is on its way.' });
    },
  );

  router.post('/password-reset/confirm', async (req, res) => {
    const input = passwordResetConfirmSchema.parse(req.body);
    await confirmPasswordReset(svc, input);
    res.status(204).end();
  });

  return router;
}
