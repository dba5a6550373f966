import { QueryTypes, type Sequelize } from 'sequelize';
import type { Logger } from 'pino';
import type { Mailer } from '../mail/send-mail.ts';
import { inTransaction } from '../db/transactions.ts';

interface DueMessage {
  id: string;
  to_address: string;
  subject: string;
  text_body: string;
  html_body: string | null;
  attempts: number;
}

/** Seconds to wait before the next attempt after `attempts` failures: 5, 10, 20… capped at 15 minutes. */
export function retryDelaySeconds(attempts: number): number {
  return Math.min(5 * 2 ** Math.max(0, attempts - 1), 900);
}

export interface DispatchOptions {
  /** Most messages one pass sends. */
  batch?: number;
  /** Only this organization's messages (tests). */
  orgId?: string;
}

/**
 * One pass over the due messages: each is sent and marked sent in the transaction that holds
 * its row lock (SKIP LOCKED), so concurrent dispatchers never send one twice; a failure
 * counts the attempt and schedules the next with backoff. Returns how many were sent and failed.
 */
export async function dispatchOutbox(
  sequelize: Sequelize,
  mailer: Mailer,
  options: DispatchOptions = {},
): Promise<{ sent: number; failed: number }> {
  return inTransaction(sequelize, 'system', async (tx) => {
    const q = <T extends object>(sql: string, bind: unknown[]) =>
      tx.sequelize.query<T>(sql, { bind, transaction: tx.transaction, type: QueryTypes.SELECT });
    const due = await q<DueMessage>(
      `SELECT id, to_address, subject, text_body, html_body, attempts FROM outbox_messages
        WHERE sent_at IS NULL AND next_attempt_at <= now() AND ($2::uuid IS NULL OR org_id = $2)
        ORDER BY created_at, id LIMIT $1 FOR UPDATE SKIP LOCKED`,
      [options.batch ?? 20, options.orgId ?? null],
    );
    let sent = 0;
    let failed = 0;
    for (const m of due) {
      try {
        await mailer.send({
          to: m.to_address,
          subject: m.subject,
          text: m.text_body,
          ...(m.html_body ? { html: m.html_body } : {}),
        });
        await q(
          `UPDATE outbox_messages SET sent_at = now(), attempts = attempts + 1, last_error = NULL WHERE id = $1 RETURNING id`,
          [m.id],
        );
        sent += 1;
      } catch (error) {
        const attempts = m.attempts + 1;
        await q(
          `UPDATE outbox_messages SET attempts = $2, last_error = $3,
                  next_attempt_at = now() + make_interval(secs => $4) WHERE id = $1 RETURNING id`,
          [
            m.id,
            attempts,
            String(error instanceof Error ? error.message : error).slice(0, 500),
            retryDelaySeconds(attempts),
          ],
        );
        failed += 1;
      }
    }
    return { sent, failed };
  });
}

/** Polls the outbox every `intervalMs` until stopped; one pass at a time. */
export function startOutboxDispatcher(
  sequelize: Sequelize,
  mailer: Mailer,
  logger: Logger,
  intervalMs = 2000,
): { stop(): Promise<void> } {
  let running: Promise<unknown> = Promise.resolve();
  const timer = setInterval(() => {
    running = running.then(async () => {
      try {
        const { sent, failed } = await dispatchOutbox(sequelize, mailer);
        if (sent || failed) logger.info({ sent, failed }, 'outbox dispatched');
      } catch (err) {
        logger.error({ err }, 'outbox dispatch failed');
      }
    });
  }, intervalMs);
  timer.unref();
  return {
    async stop() {
      clearInterval(timer);
      await running;
    },
  };
}
