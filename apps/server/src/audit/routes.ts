import { Router } from 'express';
import { auditListQuerySchema } from '@biasproof/shared';
import { authorize, orgContextOf } from '../orgs/org-scope.ts';
import { listAuditEvents, verifyOrgChain } from './audit-log.ts';

const DAY_MS = 24 * 60 * 60 * 1000;
const isBareDate = (s: string) => /^\d{4}-\d{2}-\d{2}$/.test(s);

/** `/api/orgs/:orgId/audit/…` */
export function auditRoutes(): Router {
  const router = Router();
  router.get('/', authorize('read', 'AuditLog'), async (req, res) => {
    const q = auditListQuerySchema.parse(req.query);
    const org = orgContextOf(res);
    const to = q.to ? new Date(Date.parse(q.to) + (isBareDate(q.to) ? DAY_MS - 1 : 0)) : undefined;
    res.json(
      await org.read((tx) =>
        listAuditEvents(tx, tx.orgId, {
          action: q.action,
          actorUserId: q.actor,
          from: q.from ? new Date(q.from) : undefined,
          to,
          limit: q.limit,
          offset: q.offset,
        }),
      ),
    );
  });
  // Verifying the chain is part of producing trustworthy exports: the managers' right.
  router.get('/verify', authorize('export', 'AuditLog'), async (_req, res) => {
    res.json(await orgContextOf(res).read((tx) => verifyOrgChain(tx, tx.orgId)));
  });
  return router;
}
