import type { NotificationPreferences } from '@biasproof/shared';
import { inTransaction } from '../db/transactions.ts';
import { appendAuditEvent } from '../audit/audit-log.ts';
import type { Services } from '../services.ts';
import { findMailPreference, saveMailPreference, type MailPreferenceRow } from './repository.ts';

/** What a person who never chose gets: every message at once. */
const DEFAULT: NotificationPreferences = { delivery: 'immediate', digestHourUtc: 7 };

const toPreferences = (row: MailPreferenceRow | null): NotificationPreferences =>
  row ? { delivery: row.delivery, digestHourUtc: row.digest_hour_utc } : DEFAULT;

/** `GET /api/account/notifications` */
export async function getNotificationPreferences(
  svc: Services,
  userId: string,
): Promise<NotificationPreferences> {
  return inTransaction(svc.sequelize, 'system', async (tx) =>
    toPreferences(await findMailPreference(tx, userId)),
  );
}

/**
 * `PUT /api/account/notifications`: stores the choice and audits it on the person's account
 * chain. Sending the same choice again changes nothing and writes no event. Messages already
 * held for a digest go out at once after a switch to immediate (the dispatcher decides by the
 * current choice).
 */
export async function setNotificationPreferences(
  svc: Services,
  userId: string,
  input: NotificationPreferences,
): Promise<NotificationPreferences> {
  return inTransaction(svc.sequelize, 'system', async (tx) => {
    const before = toPreferences(await findMailPreference(tx, userId, { lock: true }));
    if (before.delivery === input.delivery && before.digestHourUtc === input.digestHourUtc) {
      return before;
    }
    await saveMailPreference(tx, userId, {
      delivery: input.delivery,
      digest_hour_utc: input.digestHourUtc,
    });
    await appendAuditEvent(tx, null, {
      actorUserId: userId,
      action: 'account.notifications-changed',
      targetType: 'user',
      targetId: userId,
      details: { ...input, before },
    });
    return input;
  });
}
