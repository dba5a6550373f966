import { z } from 'zod';
import { emailSchema, personNameSchema } from './common.ts';
import { newPasswordSchema } from './password-policy.ts';
import { roleListSchema, roleSchema } from '../roles.ts';

/** A row of `GET /api/orgs/:orgId/members` (a list answer `{items,total}`). */
export const memberSchema = z.object({
  userId: z.string(),
  email: z.string(),
  name: z.string(),
  roles: z.array(roleSchema),
  /** True when the person may not use this organization (disabled by an admin). */
  disabled: z.boolean(),
  joinedAt: z.string(),
});
export type Member = z.infer<typeof memberSchema>;

/** `PATCH /api/orgs/:orgId/members/:userId`: replace roles and/or disable. */
export const updateMemberRequestSchema = z
  .object({ roles: roleListSchema.optional(), disabled: z.boolean().optional() })
  .refine((b) => b.roles !== undefined || b.disabled !== undefined, {
    message: 'Nothing to change.',
  });

/** A row of `GET /api/orgs/:orgId/invitations` (pending ones unless `?status=all`). */
export const invitationSchema = z.object({
  id: z.string(),
  email: z.string(),
  roles: z.array(roleSchema),
  invitedBy: z.object({ id: z.string(), name: z.string() }),
  createdAt: z.string(),
  expiresAt: z.string(),
  status: z.enum(['pending', 'accepted', 'revoked', 'expired']),
});
export type Invitation = z.infer<typeof invitationSchema>;

/** `POST /api/orgs/:orgId/invitations` */
export const createInvitationRequestSchema = z.object({
  email: emailSchema,
  roles: roleListSchema,
});
export type CreateInvitationRequest = z.input<typeof createInvitationRequestSchema>;

/** `GET /api/invitations/:token` (public): what the invitee is joining. */
export const invitationPreviewSchema = z.object({
  orgName: z.string(),
  email: z.string(),
  roles: z.array(roleSchema),
  invitedByName: z.string(),
  /** True when an account with this e-mail exists: the invitee signs in and joins instead. */
  accountExists: z.boolean(),
  expiresAt: z.string(),
});

/**
 * `POST /api/invitations/:token/accept`. A new person sends name and password; a person who is
 * signed in with the invited e-mail sends an empty body and joins with that account.
 */
export const acceptInvitationNewAccountSchema = z.object({
  name: personNameSchema,
  password: newPasswordSchema,
});
export const acceptInvitationRequestSchema = z.union([
  acceptInvitationNewAccountSchema,
  z.object({}).strict(),
]);

/** Query of `GET /api/orgs/:orgId/invitations`: pending ones (default) or all. */
export const invitationListQuerySchema = z.object({
  status: z.enum(['pending', 'all'], 'Use pending or all.').default('pending'),
});
