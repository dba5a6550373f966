import { Router, type Request } from 'express';
import { auditListQuerySchema } from '@biasproof/shared';
import { authorize, orgContextOf } from '../orgs/org-scope.ts';
import { listAuditEvents, verifyOrgChain } from './audit-log.ts';
import { exportAuditLog, type AuditExportFilter } from './export.ts';

const DAY_MS = 24 * 60 * 60 * 1000;
const isBareDate = (s: string) => /^\d{4}-\d{2}-\d{2}$/.test(s);

/** The filters of the list and the export; a bare `to` date includes that whole day (UTC). */
function parseQuery(req: Request): AuditExportFilter & { limit: number; offset: number } {
  const q = auditListQuerySchema.parse(req.query);
  return {
    action: q.action,
    actorUserId: q.actor,
    projectId: q.project,
    worksheetId: q.worksheet,
    from: q.from ? new Date(q.from) : undefined,
    to: q.to ? new Date(Date.parse(q.to) + (isBareDate(q.to) ? DAY_MS - 1 : 0)) : undefined,
    limit: q.limit,
    offset: q.offset,
  };
}

/** `/api/orgs/:orgId/audit/…` */
export function auditRoutes(): Router {
  const router = Router();
  router.get('/', authorize('read', 'AuditLog'), async (req, res) => {
    const filter = parseQuery(req);
    res.json(await orgContextOf(res).read((tx) => listAuditEvents(tx, tx.orgId, filter)));
  });
  // Verifying the chain is part of producing trustworthy exports: the managers' right.
  router.get('/verify', authorize('export', 'AuditLog'), async (_req, res) => {
    res.json(await orgContextOf(res).read((tx) => verifyOrgChain(tx, tx.orgId)));
  });
  router.get('/export.csv', authorize('export', 'AuditLog'), async (req, res) => {
    // The same filters as the list; paging does not apply to an export.
    const { limit: _limit, offset: _offset, ...filter } = parseQuery(req);
    const { filename, csv } = await exportAuditLog(orgContextOf(res), filter);
    res
      .status(200)
      .attachment(filename)
      .type('text/csv; charset=utf-8')
      .setHeader('cache-control', 'no-store')
      .send(csv);
  });
  return router;
}
