import { Router } from 'express';
import { idSchema, updateMemberRequestSchema } from '@biasproof/shared';
import { AppError } from '../errors/app-error.ts';
import { authorize, orgContextOf } from '../orgs/org-scope.ts';
import { listMembers, removeMember, updateMember } from './members.ts';

/** A malformed id names nothing: 404, like an id from another organization. */
function memberId(raw: unknown): string {
  const parsed = idSchema.safeParse(raw);
  if (!parsed.success) throw new AppError('not-found', 'No such member in this organization');
  return parsed.data;
}

/** `/api/orgs/:orgId/members/…` */
export function memberRoutes(): Router {
  const router = Router();
  router.get('/', authorize('read', 'Member'), async (_req, res) => {
    res.json(await listMembers(orgContextOf(res)));
  });
  router.patch('/:userId', authorize('update', 'Member'), async (req, res) => {
    const userId = memberId(req.params.userId);
    const input = updateMemberRequestSchema.parse(req.body);
    res.json(await updateMember(orgContextOf(res), userId, input));
  });
  router.delete('/:userId', authorize('delete', 'Member'), async (req, res) => {
    await removeMember(orgContextOf(res), memberId(req.params.userId));
    res.status(204).end();
  });
  return router;
}
