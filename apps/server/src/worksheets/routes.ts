import express, { Router } from 'express';
import {
  createWorksheetRequestSchema,
  idSchema,
  importDeckRequestSchema,
  MAX_DRAFT_BYTES,
  updateWorksheetRequestSchema,
  worksheetListQuerySchema,
} from '@biasproof/shared';
import { authorize, orgContextOf } from '../orgs/org-scope.ts';
import { createWorksheet, getWorksheet, listWorksheets, noSuchWorksheet } from './worksheets.ts';
import { updateWorksheet } from './update-worksheet.ts';
import { recomputeWorksheet } from './recompute.ts';
import { exportWorksheetDeck, importWorksheetDeck } from './deck.ts';

/** A malformed id names nothing: 404, like an id from another organization. */
function worksheetId(raw: unknown): string {
  const parsed = idSchema.safeParse(raw);
  if (!parsed.success) throw noSuchWorksheet();
  return parsed.data;
}

/** A deck may arrive as plain text (an uploaded .cir/.sp/.net file) with `?version=`. */
const deckText = express.text({
  type: ['text/plain', 'application/x-spice', 'text/x-spice'],
  limit: MAX_DRAFT_BYTES,
});

function deckInput(body: unknown, version: unknown) {
  if (typeof body !== 'string') return importDeckRequestSchema.parse(body);
  return importDeckRequestSchema.parse({
    text: body,
    version: version === undefined ? undefined : Number(version),
  });
}

/**
 * `/api/orgs/:orgId/worksheets/…`. PATCH checks its rules per worksheet (authors edit their
 * own; managers and the author assign), so it has no route-level guard.
 */
export function worksheetRoutes(): Router {
  const router = Router();
  router.get('/', authorize('read', 'Worksheet'), async (req, res) => {
    res.json(await listWorksheets(orgContextOf(res), worksheetListQuerySchema.parse(req.query)));
  });
  router.post('/', authorize('create', 'Worksheet'), async (req, res) => {
    const input = createWorksheetRequestSchema.parse(req.body);
    res.status(201).json(await createWorksheet(orgContextOf(res), input));
  });
  router.get('/:id', authorize('read', 'Worksheet'), async (req, res) => {
    res.json(await getWorksheet(orgContextOf(res), worksheetId(req.params.id)));
  });
  router.patch('/:id', async (req, res) => {
    const id = worksheetId(req.params.id);
    const input = updateWorksheetRequestSchema.parse(req.body);
    res.json(await updateWorksheet(orgContextOf(res), id, input));
  });
  router.post('/:id/compute', authorize('update', 'Worksheet'), async (req, res) => {
    res.json(await recomputeWorksheet(orgContextOf(res), worksheetId(req.params.id)));
  });
  router.get('/:id/deck', authorize('read', 'Worksheet'), async (req, res) => {
    const { filename, text } = await exportWorksheetDeck(
      orgContextOf(res),
      worksheetId(req.params.id),
    );
    res.attachment(filename).type('text/plain; charset=utf-8').send(text);
  });
  router.post('/:id/deck', deckText, authorize('update', 'Worksheet'), async (req, res) => {
    const id = worksheetId(req.params.id);
    const input = deckInput(req.body, req.query.version);
    res.json(await importWorksheetDeck(orgContextOf(res), id, input));
  });
  return router;
}
