import { z } from 'zod';

/**
 * How a person receives workflow e-mail: each message at once, or one digest a day (at
 * `digestHourUtc`) listing everything held since the last one. Invitations and password resets
 * are always sent at once.
 */
export const mailDeliveryModes = ['immediate', 'daily-digest'] as const;
export type MailDeliveryMode = (typeof mailDeliveryModes)[number];

/** `GET /api/account/notifications` and the body/answer of `PUT` the same. */
export const notificationPreferencesSchema = z.object({
  delivery: z.enum(mailDeliveryModes, 'Choose immediate or daily-digest.'),
  digestHourUtc: z
    .number('Choose the hour of the digest.')
    .int('Choose a whole hour.')
    .min(0, 'Use an hour from 0 to 23.')
    .max(23, 'Use an hour from 0 to 23.')
    .default(7),
});
export type NotificationPreferences = z.infer<typeof notificationPreferencesSchema>;
export type NotificationPreferencesInput = z.input<typeof notificationPreferencesSchema>;
