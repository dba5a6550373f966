import { z } from 'zod';
import { analysisSettingsSchema, circuitSchema, type AcSweep } from '@biasproof/calc';
import { decodeResults, type EncodedResults } from './canonical-json.ts';
import {
  descriptionTextSchema,
  pageLimitSchema,
  pageOffsetSchema,
  searchTextSchema,
} from './projects.ts';

/** Workflow states of a worksheet (its current revision); new worksheets start in `draft`. */
export const worksheetStates = [
  'draft',
  'in_check',
  'checked',
  'signed_off',
  'returned',
  'withdrawn',
  'superseded',
] as const;
export const worksheetStateSchema = z.enum(worksheetStates);
export type WorksheetState = (typeof worksheetStates)[number];

/** States in which the author may change the current revision (it is not frozen). */
export const editableWorksheetStates: readonly WorksheetState[] = ['draft', 'returned'];

/** Largest circuit the server stores or solves. */
export const MAX_CIRCUIT_ELEMENTS = 500;
/** Most frequency points one AC sweep may ask for (each point is one complex solve). */
export const MAX_SWEEP_POINTS = 2001;
/** Largest deck text or `POST /api/calc/solve` body, bytes. */
export const MAX_DRAFT_BYTES = 256 * 1024;

/** Frequencies an AC sweep visits, as the engine steps them. */
export function sweepPointCount(sweep: AcSweep): number {
  const { type, points, fstart, fstop } = sweep;
  if (type === 'lin') return points;
  const span = type === 'dec' ? Math.log10(fstop / fstart) : Math.log2(fstop / fstart);
  return Math.floor(points * span + 1e-9) + 1;
}

/** A circuit as the API takes it: the engine's schema, capped in size. */
export const apiCircuitSchema = circuitSchema.extend({
  elements: circuitSchema.shape.elements.max(
    MAX_CIRCUIT_ELEMENTS,
    `A circuit has at most ${MAX_CIRCUIT_ELEMENTS} elements.`,
  ),
});

/** Analysis settings as the API takes them: the engine's schema, with a bounded sweep. */
export const apiSettingsSchema = analysisSettingsSchema.refine(
  (s) => sweepPointCount(s.sweep) <= MAX_SWEEP_POINTS,
  {
    message: `The sweep visits more than ${MAX_SWEEP_POINTS} frequencies; use fewer points or a narrower range.`,
    path: ['sweep'],
  },
);

/**
 * Results as stored with a revision and sent by the API: the engine's WorksheetResults with
 * non-finite numbers written as strings (see canonical-json.ts). Parsing gives the numbers back.
 */
export const storedResultsSchema = z
  .custom<EncodedResults>(
    (v) =>
      typeof v === 'object' && v !== null && typeof (v as { status?: unknown }).status === 'string',
    'Results must be an object with a status.',
  )
  .transform((v) => decodeResults(v));

export const personRefSchema = z.object({ id: z.string(), name: z.string() });
export type PersonRef = z.infer<typeof personRefSchema>;

/** A row of `GET /api/orgs/:orgId/worksheets` (a list answer `{items,total}`). */
export const worksheetListItemSchema = z.object({
  id: z.string(),
  title: z.string(),
  /** What the analog block is and does. */
  description: z.string(),
  state: worksheetStateSchema,
  projectId: z.string(),
  projectName: z.string(),
  projectCode: z.string(),
  /** Letter of the current revision (A, B, C…). */
  revision: z.string(),
  /** Optimistic-locking counter: send it back with `PATCH`; it grows with every saved change. */
  version: z.number().int().min(1),
  author: personRefSchema,
  checker: personRefSchema.nullable(),
  approver: personRefSchema.nullable(),
  /** Outcome of the stored computation of the current revision. */
  resultStatus: z.enum(['solved', 'failed', 'empty']),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type WorksheetListItem = z.infer<typeof worksheetListItemSchema>;

/** The current revision of a worksheet: what the author saved and what the server computed from it. */
export const revisionSchema = z.object({
  letter: z.string(),
  circuit: circuitSchema,
  settings: analysisSettingsSchema,
  results: storedResultsSchema,
  /** Version of the engine (packages/calc) that computed `results`. */
  engineVersion: z.string(),
  /** SHA-256 (hex) of the canonical JSON of `{circuit, settings, results}`. */
  contentHash: z.string().regex(/^[0-9a-f]{64}$/),
  /** Frozen at submission: never changed again. */
  frozen: z.boolean(),
  createdAt: z.string(),
  createdBy: personRefSchema,
});
export type Revision = z.infer<typeof revisionSchema>;

/** `GET /api/orgs/:orgId/worksheets/:id` and the answer of every change to a worksheet. */
export const worksheetSchema = worksheetListItemSchema.extend({ currentRevision: revisionSchema });
export type Worksheet = z.infer<typeof worksheetSchema>;

const titleSchema = z
  .string()
  .trim()
  .min(1, 'Enter a title.')
  .max(200, 'A title has at most 200 characters.');
const versionSchema = z
  .number('Send the version you last read.')
  .int('Send the version you last read.')
  .min(1, 'Send the version you last read.');
const assigneeSchema = z.uuid('Choose a member of this organization.').nullable();

/** `POST /api/orgs/:orgId/worksheets`: a draft at revision A, computed on the server at once. */
export const createWorksheetRequestSchema = z.object({
  projectId: z.uuid('Choose a project.'),
  title: titleSchema,
  description: descriptionTextSchema.default(''),
  /** Initial circuit; an empty one when absent. */
  circuit: apiCircuitSchema.optional(),
  /** Initial analysis settings; the engine's defaults when absent. */
  settings: apiSettingsSchema.optional(),
});
export type CreateWorksheetRequest = z.input<typeof createWorksheetRequestSchema>;

/**
 * `PATCH /api/orgs/:orgId/worksheets/:id`. `version` is the one last read; when someone saved
 * since, the answer is 409 `stale-version`. A new circuit or new settings are computed on the
 * server in the same request. Assigning (`checkerId`, `approverId`; null unassigns) needs the
 * `assign` right or being the author.
 */
export const updateWorksheetRequestSchema = z
  .object({
    version: versionSchema,
    title: titleSchema.optional(),
    description: descriptionTextSchema.optional(),
    circuit: apiCircuitSchema.optional(),
    settings: apiSettingsSchema.optional(),
    checkerId: assigneeSchema.optional(),
    approverId: assigneeSchema.optional(),
  })
  .refine(({ version: _version, ...rest }) => Object.values(rest).some((v) => v !== undefined), {
    message: 'Nothing to change.',
  });
export type UpdateWorksheetRequest = z.input<typeof updateWorksheetRequestSchema>;

const isState = (s: string): s is WorksheetState =>
  (worksheetStates as readonly string[]).includes(s);

/** One state or several separated by commas (`draft,returned`). */
const stateList = z.string().transform((text, ctx) => {
  const list = text
    .split(',')
    .map((x) => x.trim())
    .filter(Boolean);
  const unknown = list.filter((x) => !isState(x));
  if (unknown.length > 0) {
    ctx.addIssue({
      code: 'custom',
      message: `Unknown state ${unknown.join(', ')}; use states among ${worksheetStates.join(', ')}.`,
    });
    return z.NEVER;
  }
  return list.filter(isState);
});

/**
 * Query of `GET /api/orgs/:orgId/worksheets`: filters `projectId`, `state` (one, or several
 * separated by commas), `authorId`, `assignedToMe=true` (I am its checker or approver), `q`
 * (title and description); `sort` = `updatedAt` (default, newest first), `title` or `state`
 * (workflow order), `dir` = `asc` | `desc`; `limit` (1–100, default 50) and `offset`.
 */
export const worksheetListQuerySchema = z.object({
  projectId: z.uuid('Choose a project.').optional(),
  state: stateList.optional(),
  authorId: z.uuid('Choose a person.').optional(),
  assignedToMe: z
    .enum(['true', 'false'], 'Use true or false.')
    .transform((v) => v === 'true')
    .optional(),
  q: searchTextSchema.optional(),
  sort: z
    .enum(['title', 'updatedAt', 'state'], 'Sort by title, updatedAt or state.')
    .default('updatedAt'),
  dir: z.enum(['asc', 'desc'], 'Use asc or desc.').optional(),
  limit: pageLimitSchema.default(50),
  offset: pageOffsetSchema.default(0),
});
export type WorksheetListQuery = z.input<typeof worksheetListQuerySchema>;

/**
 * `POST /api/orgs/:orgId/worksheets/:id/deck` as JSON; the deck may also be sent as the
 * `text/plain` body, with the version in `?version=`.
 */
export const importDeckRequestSchema = z.object({
  text: z
    .string('Send the deck text.')
    .min(1, 'The deck is empty.')
    .max(MAX_DRAFT_BYTES, 'The deck is larger than 256 kB.'),
  version: versionSchema.optional(),
});
export type ImportDeckRequest = z.input<typeof importDeckRequestSchema>;

export const deckWarningSchema = z.object({
  line: z.number().int(),
  message: z.string(),
  text: z.string(),
});

/** Answer of a deck import: the saved worksheet and what the parser ignored or assumed. */
export const importDeckResponseSchema = z.object({
  worksheet: worksheetSchema,
  warnings: z.array(deckWarningSchema),
});
export type ImportDeckResponse = z.infer<typeof importDeckResponseSchema>;

/** `POST /api/calc/solve`: an unsaved draft; the answer is its results (storedResultsSchema). */
export const solveRequestSchema = z.object({
  circuit: apiCircuitSchema,
  settings: apiSettingsSchema.prefault({}),
});
export type SolveRequest = z.input<typeof solveRequestSchema>;
