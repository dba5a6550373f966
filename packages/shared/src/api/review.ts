import { z } from 'zod';
import { workflowActions } from '../workflow.ts';
import { personRefSchema, worksheetListItemSchema, worksheetStateSchema } from './worksheets.ts';

/** Signature meanings an organization offers when its settings name none. */
export const defaultSignatureMeanings = ['Reviewed', 'Approved for release'] as const;

const versionSchema = z
  .number('Send the version you last read.')
  .int('Send the version you last read.')
  .min(1, 'Send the version you last read.');
const commentSchema = z.string().trim().max(4000, 'A comment has at most 4000 characters.');

/**
 * `POST /api/orgs/:orgId/worksheets/:id/transitions`: one workflow step on the version last
 * read (409 `stale-version` otherwise). `sign` needs a `meaning` from the organization's list
 * and the signer's `password` re-entered.
 */
export const transitionRequestSchema = z
  .object({
    action: z.enum(workflowActions, `Choose one of ${workflowActions.join(', ')}.`),
    version: versionSchema,
    meaning: z.string().trim().min(1, 'Choose the meaning of your signature.').optional(),
    password: z.string().min(1, 'Enter your password to sign.').max(1024).optional(),
    comment: commentSchema.optional(),
  })
  .superRefine((body, ctx) => {
    if (body.action !== 'sign') return;
    if (!body.meaning) {
      ctx.addIssue({
        code: 'custom',
        path: ['meaning'],
        message: 'Choose the meaning of your signature.',
      });
    }
    if (!body.password) {
      ctx.addIssue({ code: 'custom', path: ['password'], message: 'Enter your password to sign.' });
    }
  });
export type TransitionRequest = z.input<typeof transitionRequestSchema>;

/** One action of `GET …/worksheets/:id/actions`: allowed, or blocked with the reason. */
export const actionVerdictSchema = z.object({
  action: z.enum(workflowActions),
  allowed: z.boolean(),
  from: worksheetStateSchema,
  to: worksheetStateSchema.optional(),
  code: z
    .enum(['forbidden', 'invalid-transition', 'open-findings', 'assignment-missing'])
    .optional(),
  reason: z.string().optional(),
});
export const availableActionsResponseSchema = z.object({
  items: z.array(actionVerdictSchema),
  openMajorFindings: z.number().int().min(0),
  /** The meanings a signature may carry in this organization. */
  signatureMeanings: z.array(z.string()),
});
export type AvailableActionsResponse = z.infer<typeof availableActionsResponseSchema>;

export const findingSeverities = ['note', 'minor', 'major'] as const;
export const findingStatuses = ['open', 'answered', 'closed'] as const;

/** A result or input path of a revision, e.g. `devices.q1.ic` or `elements.r2.value`. */
export const findingPathSchema = z
  .string('Name the number the finding is about.')
  .trim()
  .max(200, 'A path has at most 200 characters.')
  .regex(/^[A-Za-z0-9_$-]+(\.[A-Za-z0-9_$-]+)*$/, 'Use a dotted path such as devices.q1.ic.');

/** `POST /api/orgs/:orgId/worksheets/:id/findings` (checker): pinned to the current revision. */
export const createFindingRequestSchema = z.object({
  path: findingPathSchema,
  severity: z.enum(findingSeverities, 'Choose note, minor or major.'),
  text: z
    .string('Describe the finding.')
    .trim()
    .min(1, 'Describe the finding.')
    .max(4000, 'A finding has at most 4000 characters.'),
});
export type CreateFindingRequest = z.input<typeof createFindingRequestSchema>;

/** `POST …/findings/:findingId/answer` (author, text required), `/close` and `/reopen` (checker). */
export const findingAnswerRequestSchema = z.object({
  text: commentSchema.min(1, 'Write your answer.'),
});
export const findingCommentRequestSchema = z.object({ text: commentSchema.default('') });

/**
 * `POST /api/orgs/:orgId/findings/:findingId/replies`: a comment in the thread that moves
 * nothing (the author, a checker or an approver of the organization; status unchanged).
 */
export const findingReplyRequestSchema = z.object({
  text: commentSchema.min(1, 'Write your reply.'),
});
export type FindingReplyRequest = z.input<typeof findingReplyRequestSchema>;

export const findingReplyKinds = ['answer', 'close', 'reopen', 'reply'] as const;

/** A number as a finding pins it: finite numbers as numbers, anything else as text, null when absent. */
export const pinnedValueSchema = z.union([z.number(), z.string()]).nullable();

export const findingReplySchema = z.object({
  id: z.string(),
  kind: z.enum(findingReplyKinds),
  text: z.string(),
  by: personRefSchema,
  at: z.string(),
});

export const findingSchema = z.object({
  id: z.string(),
  worksheetId: z.string(),
  /** Letter of the revision the finding was raised on. */
  revision: z.string(),
  path: z.string(),
  severity: z.enum(findingSeverities),
  text: z.string(),
  status: z.enum(findingStatuses),
  createdBy: personRefSchema,
  createdAt: z.string(),
  updatedAt: z.string(),
  replies: z.array(findingReplySchema),
  /** Raised on an earlier revision than the worksheet's current one and not closed there: carried forward. */
  carried: z.boolean(),
  /** The pinned number in the revision the finding was raised on. */
  pinnedValue: pinnedValueSchema,
  /** The same path in the worksheet's current revision. */
  currentValue: pinnedValueSchema,
  /** True when the current revision's number differs from the pinned one (a carried finding to look at again). */
  valueChanged: z.boolean(),
});
export type Finding = z.infer<typeof findingSchema>;
export const findingListSchema = z.object({ items: z.array(findingSchema), total: z.number() });

/** The manifestation of an electronic signature, shown with every display of the signed revision. */
export const signatureSchema = z.object({
  id: z.string(),
  revision: z.string(),
  signer: personRefSchema,
  printedName: z.string(),
  meaning: z.string(),
  /** SHA-256 of the signed revision's content. */
  contentHash: z.string(),
  /** UTC, ISO 8601. */
  signedAt: z.string(),
  /** Set when a later revision of the worksheet was signed. */
  supersededAt: z.string().nullable(),
});
export type Signature = z.infer<typeof signatureSchema>;
export const signatureListSchema = z.object({ items: z.array(signatureSchema), total: z.number() });

/**
 * `GET /api/orgs/:orgId/queue`: the signed-in member's work. `toCheck`: in check with me as
 * checker; `toSign`: checked with me as approver; `returnedToMe`: returned, my worksheets;
 * `recentlySigned`: signed off in the last 30 days where I was author, checker or approver
 * (newest first, at most 20 each list).
 */
export const queueResponseSchema = z.object({
  toCheck: z.array(worksheetListItemSchema),
  toSign: z.array(worksheetListItemSchema),
  returnedToMe: z.array(worksheetListItemSchema),
  recentlySigned: z.array(worksheetListItemSchema),
});
export type QueueResponse = z.infer<typeof queueResponseSchema>;

/**
 * `GET /api/orgs/:orgId/worksheets/:id/watchers`, and the answer of `PUT` / `DELETE …/watchers/me`
 * (start / stop watching): the people e-mailed when the worksheet is signed off, beside its
 * author and checker.
 */
export const watchersResponseSchema = z.object({
  watching: z.boolean(),
  watchers: z.array(personRefSchema),
});
export type WatchersResponse = z.infer<typeof watchersResponseSchema>;
