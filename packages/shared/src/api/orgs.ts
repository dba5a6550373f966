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
  details: z.record(z.string(), z.unknown()),
});
export type AuditEvent = z.infer<typeof auditEventSchema>;
