import { Router } from 'express';
import {
  acceptInvitationNewAccountSchema,
  createInvitationRequestSchema,
  idSchema,
  invitationListQuerySchema,
} from '@biasproof/shared';
import { AppError } from '../errors/app-error.ts';
import { authorize, orgContextOf } from '../orgs/org-scope.ts';
import type { Services } from '../services.ts';
import type { Csrf } from '../auth/csrf.ts';
import { startSignedInSession } from '../auth/session.ts';
import { getMe } from '../auth/account.ts';
import {
  inviteMember,
  listInvitations,
  resendInvitation,
  revokeInvitation,
} from './invitations.ts';
import { acceptInvitation, previewInvitation, type Acceptance } from './accept-invitation.ts';

function invitationId(raw: unknown): string {
  const parsed = idSchema.safeParse(raw);
  if (!parsed.success) throw new AppError('not-found', 'No such invitation in this organization');
  return parsed.data;
}

/** `/api/orgs/:orgId/invitations/…` (admins). */
export function invitationAdminRoutes(svc: Services): Router {
  const router = Router();
  router.get('/', authorize('read', 'Invitation'), async (req, res) => {
    const { status } = invitationListQuerySchema.parse(req.query);
    res.json(await listInvitations(orgContextOf(res), status));
  });
  router.post('/', authorize('create', 'Invitation'), async (req, res) => {
    const input = createInvitationRequestSchema.parse(req.body);
    res.status(201).json(await inviteMember(svc, orgContextOf(res), input));
  });
  router.post('/:id/resend', authorize('update', 'Invitation'), async (req, res) => {
    res.json(await resendInvitation(svc, orgContextOf(res), invitationId(req.params.id)));
  });
  router.delete('/:id', authorize('delete', 'Invitation'), async (req, res) => {
    await revokeInvitation(orgContextOf(res), invitationId(req.params.id));
    res.status(204).end();
  });
  return router;
}

/** `/api/invitations/:token…`: what the invitee sees before signing in. */
export function invitationPublicRoutes(svc: Services, csrf: Csrf): Router {
  const router = Router();
  router.get('/:token', async (req, res) => {
    res.json(await previewInvitation(svc, req.params.token));
  });
  router.post('/:token/accept', async (req, res) => {
    const body: unknown = req.body ?? {};
    const isEmpty = typeof body === 'object' && body !== null && Object.keys(body).length === 0;
    const acceptance: Acceptance = isEmpty
      ? { kind: 'existing-account', signedInUserId: req.session.userId ?? null }
      : { kind: 'new-account', account: acceptInvitationNewAccountSchema.parse(body) };
    const { userId } = await acceptInvitation(svc, req.params.token, acceptance);
    if (req.session.userId !== userId) {
      await startSignedInSession(req, userId);
      res.setHeader('x-csrf-token', csrf.issueToken(req, res, { fresh: true }));
    }
    res.json(await getMe(svc, userId));
  });
  return router;
}
