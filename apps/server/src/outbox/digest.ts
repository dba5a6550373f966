import { QueryTypes, type Sequelize } from 'sequelize';
import { inTransaction, type Tx } from '../db/transactions.ts';
import { composeMail, type MailLink } from '../mail/compose.ts';
import { isWorkflowKind } from './outbox.ts';

const HOUR_MS = 60 * 60 * 1000;
const DAY_MS = 24 * HOUR_MS;

/** The latest digest time at or before `now`: today at `hourUtc`, or yesterday's when that is later than now. */
export function lastDigestSlot(now: Date, hourUtc: number): Date {
  const today = Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate(), hourUtc);
  return new Date(today <= now.getTime() ? today : today - DAY_MS);
}

interface Recipient {
  email: string;
  name: string;
  digest_hour_utc: number;
}

interface HeldMessage {
  id: string;
  subject: string;
  link: string | null;
  text_body: string;
}

const select = <T extends object>(tx: Tx, sql: string, bind: unknown[]) =>
  tx.sequelize.query<T>(sql, { bind, transaction: tx.transaction, type: QueryTypes.SELECT });

/** The message's own link, or (for a writer that gave none) the first web address in its text. */
const linkOf = (m: HeldMessage): string | null =>
  m.link ?? /https?:\/\/[^\s<>"]+/.exec(m.text_body)?.[0] ?? null;

function digestMail(recipient: Recipient, held: HeldMessage[], day: string) {
  const items: (string | MailLink)[] = held.map((m) => {
    const url = linkOf(m);
    return url ? { label: m.subject, url } : m.subject;
  });
  const first = held.map(linkOf).find((u) => u !== null);
  const n = held.length;
  return {
    subject: `Biasproof digest for ${day}: ${n} update${n === 1 ? '' : 's'}`,
    ...composeMail({
      greeting: `Hello ${recipient.name},`,
      paragraphs: [`What happened on your worksheets since the last digest:`, items],
      ...(first ? { link: { url: `${new URL(first).origin}/`, label: 'Open Biasproof' } } : {}),
      footer:
        `You receive workflow e-mail as one digest a day at ${String(recipient.digest_hour_utc).padStart(2, '0')}:00 UTC. ` +
        'Change this in your account’s notification settings.',
    }),
  };
}

/**
 * Writes one digest for one person, if their digest time has passed since the last one: every
 * workflow message held for them from before that time, listed in a new outbox message (no
 * organization: it may span several), and each held message marked sent, naming the digest,
 * in the same transaction. The unique (address, day) index makes a second digest for the same
 * day a no-op, however many dispatchers race.
 */
async function composeDigestFor(sequelize: Sequelize, r: Recipient, now: Date): Promise<boolean> {
  const slot = lastDigestSlot(now, r.digest_hour_utc);
  const day = slot.toISOString().slice(0, 10);
  return inTransaction(sequelize, 'system', async (tx) => {
    const held = await select<HeldMessage>(
      tx,
      `SELECT id, subject, link, text_body FROM outbox_messages
        WHERE sent_at IS NULL AND lower(to_address) = $1 AND ${isWorkflowKind('kind')}
          AND created_at < $2 AND (claimed_until IS NULL OR claimed_until <= $3)
        ORDER BY created_at, id
        FOR UPDATE SKIP LOCKED`,
      [r.email, slot, now],
    );
    if (held.length === 0) return false;
    const mail = digestMail(r, held, day);
    const [digest] = await select<{ id: string }>(
      tx,
      `INSERT INTO outbox_messages (org_id, kind, to_address, subject, text_body, html_body, digest_day)
       VALUES (NULL, 'digest.daily', $1, $2, $3, $4, $5)
       ON CONFLICT (lower(to_address), digest_day) WHERE digest_day IS NOT NULL DO NOTHING
       RETURNING id`,
      [r.email, mail.subject, mail.text, mail.html, day],
    );
    if (!digest) return false;
    await select(
      tx,
      `UPDATE outbox_messages SET sent_at = $2, digest_id = $3, last_error = NULL
        WHERE id = ANY($1::uuid[]) RETURNING id`,
      [held.map((m) => m.id), now, digest.id],
    );
    return true;
  });
}

/** Writes every digest that is due at `now`; returns how many. */
export async function composeDueDigests(sequelize: Sequelize, now: Date): Promise<number> {
  const recipients = await inTransaction(sequelize, 'system', (tx) =>
    select<Recipient>(
      tx,
      `SELECT u.email, u.name, p.digest_hour_utc FROM mail_preferences p JOIN users u ON u.id = p.user_id
        WHERE p.delivery = 'daily-digest'
          AND EXISTS (SELECT 1 FROM outbox_messages m
                       WHERE m.sent_at IS NULL AND lower(m.to_address) = u.email
                         AND ${isWorkflowKind('m.kind')})`,
      [],
    ),
  );
  let written = 0;
  for (const r of recipients) if (await composeDigestFor(sequelize, r, now)) written += 1;
  return written;
}
