import { z } from 'zod';
import { personRefSchema, revisionSchema, worksheetStateSchema } from './worksheets.ts';
import { signatureSchema } from './review.ts';

/**
 * A revision in the history of a worksheet, `GET /api/orgs/:orgId/worksheets/:id/revisions`
 * (oldest first). `state` is the revision's own state: the current one shares the worksheet's;
 * an earlier one keeps where it ended (`signed_off`, `superseded` once a later revision is
 * signed, `returned`, `withdrawn`).
 */
export const revisionSummarySchema = z.object({
  letter: z.string(),
  state: worksheetStateSchema,
  contentHash: z.string(),
  frozen: z.boolean(),
  engineVersion: z.string(),
  createdAt: z.string(),
  createdBy: personRefSchema,
  /** When it was submitted for check (frozen), if it was. */
  submittedAt: z.string().nullable(),
  /** Every signature of this revision (the manifestation), oldest first. */
  signatures: z.array(signatureSchema),
  /** Findings raised on this revision. */
  findingCount: z.number().int().min(0),
});
export type RevisionSummary = z.infer<typeof revisionSummarySchema>;
export const revisionHistorySchema = z.object({
  items: z.array(revisionSummarySchema),
  total: z.number(),
});
export type RevisionHistory = z.infer<typeof revisionHistorySchema>;

/** `GET …/worksheets/:id/revisions/:letter`: one revision in full with its state and signatures. */
export const revisionDetailSchema = revisionSchema.extend({
  state: worksheetStateSchema,
  signatures: z.array(signatureSchema),
});
export type RevisionDetail = z.infer<typeof revisionDetailSchema>;

/** A revision letter in a path or query: A…Z, then AA… */
export const revisionLetterSchema = z
  .string('Name a revision letter.')
  .trim()
  .regex(/^[A-Z]{1,3}$/, 'Use a revision letter such as A or B.');

/** Query of `GET …/worksheets/:id/diff?from=A&to=B`. */
export const revisionDiffQuerySchema = z.object({
  from: revisionLetterSchema,
  to: revisionLetterSchema,
});

/** A scalar as the diff compares it: finite numbers as numbers, anything else as text. */
const diffValueSchema = z.union([z.number(), z.string(), z.boolean()]).nullable();

/**
 * One difference between two revisions at a dotted path (`elements.r2.value`,
 * `results.devices.q1.ic`). `delta` = after − before and `relative` = delta / |before| when both
 * are finite numbers (relative absent when before is 0).
 */
export const diffEntrySchema = z.object({
  path: z.string(),
  change: z.enum(['added', 'removed', 'changed']),
  before: diffValueSchema,
  after: diffValueSchema,
  delta: z.number().optional(),
  relative: z.number().optional(),
});
export type DiffEntry = z.infer<typeof diffEntrySchema>;

/** `GET …/diff`: inputs (circuit and settings) and results that differ, each sorted by path. */
export const revisionDiffSchema = z.object({
  from: z.string(),
  to: z.string(),
  inputs: z.array(diffEntrySchema),
  results: z.array(diffEntrySchema),
  /** Result numbers that moved by less than this relative amount are not listed (float noise). */
  tolerance: z.number(),
});
export type RevisionDiff = z.infer<typeof revisionDiffSchema>;
