import { z } from 'zod';

/** `GET /api/orgs/:orgId` */
export const organizationSchema = z.object({
  id: z.string(),
  slug: z.string(),
  name: z.string(),
  /** IANA time zone used to show dates (stored in UTC), e.g. `Europe/Berlin`. */
  timezone: z.string(),
});
export type Organization = z.infer<typeof organizationSchema>;

/** A row of `GET /api/orgs/:orgId/audit` (manager; admins see account events too). */
export const auditEventSchema = z.object({
  id: z.string(),
  at: z.string(),
  actor: z.object({ id: z.string(), name: z.string() }).nullable(),
  /** Dotted action name, e.g. `member.roles-changed`, `invitation.created`, `auth.locked`. */
  action: z.string(),
  targetType: z.string(),
  targetId: z.string().nullable(),
  /** The worksheet revision letter the event concerns, when it concerns one. */
  revision: z.string().nullable(),
  /** One line a person reads, e.g. `Submitted "Mic preamp" revision A for check`. */
  summary: z.string(),
  projectId: z.string().nullable(),
  worksheetId: z.string().nullable(),
  ip: z.string().nullable(),
  userAgent: z.string().nullable(),
  details: z.record(z.string(), z.unknown()),
});
export type AuditEvent = z.infer<typeof auditEventSchema>;

const isoDateOrDateTime = z
  .string()
  .trim()
  .refine(
    (s) =>
      /^\d{4}-\d{2}-\d{2}(T\d{2}:\d{2}(:\d{2}(\.\d{1,6})?)?(Z|[+-]\d{2}:\d{2}))?$/.test(s) &&
      !Number.isNaN(Date.parse(s)),
    'Use a date like 2026-12-01 or a date-time like 2026-12-01T09:30:00Z.',
  );

/**
 * Query of `GET /api/orgs/:orgId/audit`: `action` (exact name), `actor` (user id), `from`/`to`
 * (ISO date or date-time, inclusive; a bare `to` date includes that whole day, UTC),
 * `project` and `worksheet` (ids), paging. `GET …/audit/export.csv` takes the same filters
 * without paging and answers every matching row as CSV.
 */
export const auditListQuerySchema = z.object({
  action: z
    .string()
    .trim()
    .min(1)
    .max(100, 'An action name has at most 100 characters.')
    .optional(),
  actor: z.uuid('Choose a person from the list.').optional(),
  project: z.uuid('Choose a project from the list.').optional(),
  worksheet: z.uuid('Choose a worksheet from the list.').optional(),
  from: isoDateOrDateTime.optional(),
  to: isoDateOrDateTime.optional(),
  limit: z.coerce
    .number()
    .int('Use a whole number.')
    .min(1, 'Use 1 to 500.')
    .max(500, 'Use 1 to 500.')
    .default(100),
  offset: z.coerce.number().int('Use a whole number.').min(0, 'Use 0 or more.').default(0),
});
export type AuditListQuery = z.input<typeof auditListQuerySchema>;

/** `GET /api/orgs/:orgId/audit/verify`: whether the organization's hash chain is intact. */
export const auditVerifyResponseSchema = z.object({
  ok: z.boolean(),
  events: z.number().int().min(0),
  firstBadEventId: z.string().optional(),
});
export type AuditVerifyResponse = z.infer<typeof auditVerifyResponseSchema>;
