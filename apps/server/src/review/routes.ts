import { Router } from 'express';
import {
  createFindingRequestSchema,
  findingAnswerRequestSchema,
  findingCommentRequestSchema,
  findingReplyRequestSchema,
  idSchema,
  revisionDiffQuerySchema,
  revisionLetterSchema,
  transitionRequestSchema,
} from '@biasproof/shared';
import type { Services } from '../services.ts';
import { authorize, orgContextOf } from '../orgs/org-scope.ts';
import { noSuchWorksheet } from '../worksheets/worksheets.ts';
import { transitionWorksheet } from './transitions.ts';
import { getAvailableActions } from './actions.ts';
import { getFindings, moveFinding, noSuchFinding, raiseFinding } from './findings.ts';
import { getSignatures } from './signatures.ts';
import { getWatchers, setWatching } from './watchers.ts';
import { replyToFinding } from './finding-replies.ts';
import {
  getRevisionDetail,
  getRevisionDiff,
  getRevisionHistory,
  noSuchRevision,
} from './history.ts';
import { getQueue } from './queue.ts';

/** A malformed id names nothing: 404, like an id from another organization. */
function idOr404(raw: unknown, notFound: () => Error): string {
  const parsed = idSchema.safeParse(raw);
  if (!parsed.success) throw notFound();
  return parsed.data;
}

/**
 * `/api/orgs/:orgId/worksheets/:id/{transitions,actions,findings,signatures,revisions,diff}`:
 * the review workflow and history of one worksheet. The workflow's own guards (workflow.ts)
 * decide per worksheet.
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
    res.status(201).json(await raiseFinding(orgContextOf(res), svc.config.appUrl, id, input));
  });
  router.get('/:id/signatures', authorize('read', 'Revision'), async (req, res) => {
    res.json(await getSignatures(orgContextOf(res), worksheetId(req.params)));
  });
  router.get('/:id/revisions', authorize('read', 'Revision'), async (req, res) => {
    res.json(await getRevisionHistory(orgContextOf(res), worksheetId(req.params)));
  });
  router.get('/:id/revisions/:letter', authorize('read', 'Revision'), async (req, res) => {
    const id = worksheetId(req.params);
    const letter = revisionLetterSchema.safeParse(req.params.letter);
    if (!letter.success) throw noSuchRevision();
    res.json(await getRevisionDetail(orgContextOf(res), id, letter.data));
  });
  router.get('/:id/diff', authorize('read', 'Revision'), async (req, res) => {
    const id = worksheetId(req.params);
    const query = revisionDiffQuerySchema.parse(req.query);
    res.json(await getRevisionDiff(orgContextOf(res), id, query));
  });
  router.get('/:id/watchers', authorize('read', 'Worksheet'), async (req, res) => {
    res.json(await getWatchers(orgContextOf(res), worksheetId(req.params)));
  });
  for (const [method, watching] of [
    ['put', true],
    ['delete', false],
  ] as const) {
    router[method]('/:id/watchers/me', authorize('read', 'Worksheet'), async (req, res) => {
      res.json(await setWatching(orgContextOf(res), worksheetId(req.params), watching));
    });
  }
  return router;
}

/** `/api/orgs/:orgId/findings/:findingId/{answer,close,reopen,replies}`. */
export function findingRoutes(svc: Services): Router {
  const router = Router({ mergeParams: true });
  const appUrl = svc.config.appUrl;
  const findingId = (params: Record<string, unknown>) => idOr404(params.findingId, noSuchFinding);
  router.post('/:findingId/answer', authorize('answer', 'Finding'), async (req, res) => {
    const id = findingId(req.params);
    const { text } = findingAnswerRequestSchema.parse(req.body);
    res.json(await moveFinding(orgContextOf(res), appUrl, id, 'answer', text));
  });
  for (const step of ['close', 'reopen'] as const) {
    router.post(`/:findingId/${step}`, authorize('close', 'Finding'), async (req, res) => {
      const id = findingId(req.params);
      const { text } = findingCommentRequestSchema.parse(req.body ?? {});
      res.json(await moveFinding(orgContextOf(res), appUrl, id, step, text));
    });
  }
  router.post('/:findingId/replies', authorize('reply', 'Finding'), async (req, res) => {
    const id = findingId(req.params);
    const { text } = findingReplyRequestSchema.parse(req.body);
    res.json(await replyToFinding(orgContextOf(res), appUrl, id, text));
  });
  return router;
}

/** `/api/orgs/:orgId/queue`: the caller's review work. */
export function queueRoutes(): Router {
  const router = Router({ mergeParams: true });
  router.get('/', authorize('read', 'Worksheet'), async (_req, res) => {
    res.json(await getQueue(orgContextOf(res)));
  });
  return router;
}
