import { Router } from 'express';
import type { Services } from '../services.ts';
import { requireUser } from '../auth/require-user.ts';
import { memberRoutes } from '../members/routes.ts';
import { invitationAdminRoutes } from '../invitations/routes.ts';
import { auditRoutes } from '../audit/routes.ts';
import { projectRoutes } from '../projects/routes.ts';
import { worksheetRoutes } from '../worksheets/routes.ts';
import { modelLibraryRoutes } from '../models/routes.ts';
import { findingRoutes, queueRoutes, worksheetReviewRoutes } from '../review/routes.ts';
import { attachmentRoutes, worksheetAttachmentRoutes } from '../attachments/routes.ts';
import { authorize, orgContextOf, orgScope } from './org-scope.ts';
import { getOrganization } from './organizations.ts';

/**
 * `/api/orgs/:orgId/…`: everything below passes the tenant gate (orgScope) first, so routes
 * only ever see their own organization through the org context.
 */
export function orgRoutes(svc: Services): Router {
  const router = Router({ mergeParams: true });
  router.use(requireUser(svc.sequelize), orgScope(svc.sequelize));
  router.get('/', authorize('read', 'Organization'), async (_req, res) => {
    res.json(await getOrganization(orgContextOf(res)));
  });
  router.use('/members', memberRoutes());
  router.use('/invitations', invitationAdminRoutes(svc));
  router.use('/audit', auditRoutes());
  router.use('/projects', projectRoutes());
  router.use('/worksheets', worksheetReviewRoutes(svc), worksheetRoutes());
  router.use('/findings', findingRoutes(svc));
  router.use('/queue', queueRoutes());
  router.use('/models', modelLibraryRoutes());
  router.use('/worksheets', worksheetAttachmentRoutes());
  router.use('/attachments', attachmentRoutes());
  return router;
}
