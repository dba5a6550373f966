import { Router } from 'express';
import {
  createFindingRequestSchema,
  findingAnswerRequestSchema,
  findingCommentRequestSchema,
  idSchema,
  transitionRequestSchema,
} from '@biasproof/shared';
import type { Services } from '../services.ts';
import { authorize, orgContextOf } from '../orgs/org-scope.ts';
import { noSuchWorksheet } from '../worksheets/worksheets.ts';
import { transitionWorksheet } from './transitions.ts';
import { getAvailableActions } from './actions.ts';
import { getFindings, moveFinding, noSuchFinding, raiseFinding } from './findings.ts';
import { getSignatures } from './signatures.ts';

/** A malformed id names nothing: 404, like an id from another organization. */
function idOr404(raw: unknown, notFound: () => Error): string {
  const parsed = idSchema.safeParse(raw);
  if (!parsed.success) throw notFound();
  return parsed.data;
}

/**
 * `/api/orgs/:orgId/worksheets/:id/{transitions,actions,findings,signatures}`: the review
 * workflow of one worksheet. The workflow's own guards (workflow.ts) decide per worksheet.
 */
export function worksheetReviewRoutes(svc: Services): Router {
  const router = Router({ mergeParams: true });
  const worksheetId = (params: Record<string, unknown>) => idOr404(params.id, noSuchWorksheet);
  router.post('/:id/transitions', async (req, res) => {
    const id = worksheetId(req.params);
    const input = transitionRequestSchema.parse(req.body);
    res.json(await transitionWorksheet(orgContextOf(res), svc, id, input));
  });
  router.get('/:id/actions', authorize('read', 'Worksheet'), async (req, res) => {
    res.json(await getAvailableActions(orgContextOf(res), worksheetId(req.params)));
  });
  router.get('/:id/findings', authorize('read', 'Finding'), async (req, res) => {
    res.json(await getFindings(orgContextOf(res), worksheetId(req.params)));
  });
  router.post('/:id/findings', authorize('create', 'Finding'), async (req, res) => {
    const id = worksheetId(req.params);
    const input = createFindingRequestSchema.parse(req.body);
    res.status(201).json(await raiseFinding(orgContextOf(res), id, input));
  });
  router.get('/:id/signatures', authorize('read', 'Revision'), async (req, res) => {
    res.json(await getSignatures(orgContextOf(res), worksheetId(req.params)));
  });
  return router;
}

/** `/api/orgs/:orgId/findings/:findingId/{answer,close,reopen}`. */
export function findingRoutes(): Router {
  const router = Router({ mergeParams: true });
  const findingId = (params: Record<string, unknown>) => idOr404(params.findingId, noSuchFinding);
  router.post('/:findingId/answer', authorize('answer', 'Finding'), async (req, res) => {
    const id = findingId(req.params);
    const { text } = findingAnswerRequestSchema.parse(req.body);
    res.json(await moveFinding(orgContextOf(res), id, 'answer', text));
  });
  for (const step of ['close', 'reopen'] as const) {
    router.post(`/:findingId/${step}`, authorize('close', 'Finding'), async (req, res) => {
      const id = findingId(req.params);
      const { text } = findingCommentRequestSchema.parse(req.body ?? {});
      res.json(await moveFinding(orgContextOf(res), id, step, text));
    });
  }
  return router;
}
