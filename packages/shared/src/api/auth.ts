import { z } from 'zod';
import { emailSchema, personNameSchema } from './common.ts';
import { newPasswordSchema } from './password-policy.ts';
import { roleSchema } from '../roles.ts';

/** `GET /api/auth/csrf` → the token to send in header `x-csrf-token` on every mutating request. */
export const csrfResponseSchema = z.object({ token: z.string().min(1) });

/** `POST /api/auth/sign-in` body; the web form validates with the same schema. */
export const signInRequestSchema = z.object({
  email: z
    .string()
    .trim()
    .min(1, 'Enter your e-mail address.')
    .pipe(z.email('Enter a valid e-mail address, like name@company.example.')),
  password: z.string().min(1, 'Enter your password.').max(200),
});
export type SignInRequest = z.infer<typeof signInRequestSchema>;

export const membershipSummarySchema = z.object({
  orgId: z.string(),
  orgSlug: z.string(),
  orgName: z.string(),
  roles: z.array(roleSchema),
});
export type MembershipSummary = z.infer<typeof membershipSummarySchema>;

export const userSummarySchema = z.object({ id: z.string(), email: z.string(), name: z.string() });

/** `GET /api/auth/me` and the answer of a successful sign-in. The shape is fixed (scripts rely on it). */
export const meResponseSchema = z.object({
  user: userSummarySchema,
  memberships: z.array(membershipSummarySchema),
});
export type MeResponse = z.infer<typeof meResponseSchema>;

/** `PATCH /api/auth/me` */
export const updateProfileRequestSchema = z.object({ name: personNameSchema });

/** `POST /api/auth/me/password`: the current password proves it is really the user. */
export const changePasswordRequestSchema = z.object({
  currentPassword: z.string().min(1, 'Enter your current password.'),
  newPassword: newPasswordSchema,
});

/** `POST /api/auth/password-reset`: always answers 202 whether or not the address has an account. */
export const passwordResetRequestSchema = z.object({ email: emailSchema });

/** `POST /api/auth/password-reset/confirm` with the token from the e-mailed link. */
export const passwordResetConfirmSchema = z.object({
  token: z.string().min(20, 'This reset link is not valid.').max(200),
  password: newPasswordSchema,
});
