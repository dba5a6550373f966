import { randomUUID } from 'node:crypto';
import { QueryTypes, type Sequelize } from 'sequelize';
import type { Logger } from 'pino';
import type { Mailer, OutgoingMail } from '../mail/send-mail.ts';
import { inTransaction } from '../db/transactions.ts';
import { isWorkflowKind } from './outbox.ts';
import { composeDueDigests } from './digest.ts';

/** Seconds to wait before the next attempt after `attempts` failures: 5, 10, 20… capped at 15 minutes. */
export function retryDelaySeconds(attempts: number): number {
  return Math.min(5 * 2 ** Math.max(0, attempts - 1), 900);
}

/**
 * How long a claim keeps other dispatchers off a message: far longer than one send can take
 * (the transport gives up after 5 s to connect, 10 s for the greeting, 60 s of silence), so
 * only a dispatcher that died mid-send lets its claim run out.
 */
export const CLAIM_LEASE_SECONDS = 300;

export interface DispatchOptions {
  /** Most messages one pass sends (default 20). */
  batch?: number;
  /** Only this organization's messages, and no digests (tests). */
  orgId?: string;
  /** Only these messages, and no digests: the immediate send after an invitation or reset. */
  ids?: readonly string[];
  /** The dispatcher's clock (default: the system clock); tests move it to a digest hour. */
  now?: () => Date;
}

export interface ClaimedMessage {
  id: string;
  claimToken: string;
  to_address: string;
  subject: string;
  text_body: string;
  html_body: string | null;
  attempts: number;
}

type Query = <T extends object>(sql: string, bind: unknown[]) => Promise<T[]>;

function systemQuery(sequelize: Sequelize): Query {
  return (sql, bind) =>
    inTransaction(sequelize, 'system', (tx) =>
      tx.sequelize.query(sql, { bind, transaction: tx.transaction, type: QueryTypes.SELECT }),
    );
}

/**
 * Claims the oldest due message for a lease, in its own short transaction, and counts the
 * attempt. Skipped: messages sent, not yet due, claimed by a live lease, or held for a
 * recipient's daily digest. SKIP LOCKED lets concurrent dispatchers claim different messages.
 */
export async function claimNextMessage(
  sequelize: Sequelize,
  now: Date,
  options: Pick<DispatchOptions, 'orgId' | 'ids'> = {},
): Promise<ClaimedMessage | null> {
  const claimToken = randomUUID();
  const [row] = await systemQuery(sequelize)<Omit<ClaimedMessage, 'claimToken'>>(
    `UPDATE outbox_messages
        SET claim_token = $1, claimed_until = $2::timestamptz + make_interval(secs => $3),
            attempts = attempts + 1
      WHERE id = (
        SELECT m.id FROM outbox_messages m
         WHERE m.sent_at IS NULL AND m.next_attempt_at <= $2
           AND (m.claimed_until IS NULL OR m.claimed_until <= $2)
           AND ($4::uuid IS NULL OR m.org_id = $4)
           AND ($5::uuid[] IS NULL OR m.id = ANY($5::uuid[]))
           AND NOT (${isWorkflowKind('m.kind')} AND EXISTS (
             SELECT 1 FROM mail_preferences p JOIN users u ON u.id = p.user_id
              WHERE p.delivery = 'daily-digest' AND u.email = lower(m.to_address)))
         ORDER BY m.created_at, m.id
         LIMIT 1
         FOR UPDATE OF m SKIP LOCKED)
      RETURNING id, to_address, subject, text_body, html_body, attempts`,
    [claimToken, now, CLAIM_LEASE_SECONDS, options.orgId ?? null, options.ids ?? null],
  );
  return row ? { ...row, claimToken } : null;
}

/** The message as the mailer sends it; its Message-ID comes from the row id, on every attempt. */
export const outgoingOf = (m: ClaimedMessage): OutgoingMail => ({
  to: m.to_address,
  subject: m.subject,
  text: m.text_body,
  ...(m.html_body ? { html: m.html_body } : {}),
  stableKey: `outbox.${m.id}`,
});

/**
 * Sends one claimed message with no transaction open, then records the outcome if the claim is
 * still ours: sent (once: `sent_at IS NULL` is part of the condition), or failed with the next
 * attempt after a backoff.
 */
export async function deliverClaimed(
  sequelize: Sequelize,
  mailer: Mailer,
  m: ClaimedMessage,
  now: Date,
): Promise<'sent' | 'failed'> {
  const q = systemQuery(sequelize);
  try {
    await mailer.send(outgoingOf(m));
  } catch (error) {
    await q(
      `UPDATE outbox_messages
          SET last_error = $3, next_attempt_at = $4::timestamptz + make_interval(secs => $5),
              claim_token = NULL, claimed_until = NULL
        WHERE id = $1 AND claim_token = $2 RETURNING id`,
      [
        m.id,
        m.claimToken,
        String(error instanceof Error ? error.message : error).slice(0, 500),
        now,
        retryDelaySeconds(m.attempts),
      ],
    );
    return 'failed';
  }
  await q(
    `UPDATE outbox_messages SET sent_at = $3, last_error = NULL, claim_token = NULL, claimed_until = NULL
      WHERE id = $1 AND claim_token = $2 AND sent_at IS NULL RETURNING id`,
    [m.id, m.claimToken, now],
  );
  return 'sent';
}

/**
 * One pass: first the daily digests that are due (each written, with its held messages marked
 * sent, in one transaction), then up to `batch` due messages, each claimed, sent and marked
 * on its own. Returns how many were sent and how many failed.
 */
export async function dispatchOutbox(
  sequelize: Sequelize,
  mailer: Mailer,
  options: DispatchOptions = {},
): Promise<{ sent: number; failed: number }> {
  const clock = options.now ?? (() => new Date());
  if (!options.orgId && !options.ids) await composeDueDigests(sequelize, clock());
  let sent = 0;
  let failed = 0;
  for (let i = 0; i < (options.batch ?? 20); i += 1) {
    const claimed = await claimNextMessage(sequelize, clock(), options);
    if (!claimed) break;
    if ((await deliverClaimed(sequelize, mailer, claimed, clock())) === 'sent') sent += 1;
    else failed += 1;
  }
  return { sent, failed };
}

/**
 * Sends the given messages now, without waiting for the next poll and without holding up the
 * caller (invitations and password resets). Whatever fails here the poller retries.
 */
export function dispatchSoon(
  svc: { sequelize: Sequelize; mailer: Mailer; logger: Logger },
  ids: readonly string[],
): void {
  if (ids.length === 0) return;
  dispatchOutbox(svc.sequelize, svc.mailer, { ids }).catch((err: unknown) => {
    svc.logger.error({ err }, 'outbox: immediate send failed; the poller will retry');
  });
}

/** Polls the outbox every `intervalMs` until stopped; a tick while a pass runs is skipped. */
export function startOutboxDispatcher(
  sequelize: Sequelize,
  mailer: Mailer,
  logger: Logger,
  intervalMs = 2000,
  options: Pick<DispatchOptions, 'now'> = {},
): { stop(): Promise<void> } {
  let running: Promise<void> | null = null;
  const pass = async () => {
    try {
      const { sent, failed } = await dispatchOutbox(sequelize, mailer, options);
      if (sent || failed) logger.info({ sent, failed }, 'outbox dispatched');
    } catch (err) {
      logger.error({ err }, 'outbox dispatch failed');
    } finally {
      running = null;
    }
  };
  const timer = setInterval(() => {
    running ??= pass();
  }, intervalMs);
  timer.unref();
  return {
    async stop() {
      clearInterval(timer);
      await running;
    },
  };
}
