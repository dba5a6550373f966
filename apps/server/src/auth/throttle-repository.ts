import { QueryTypes } from 'sequelize';
import type { Tx } from '../db/transactions.ts';

export interface ThrottleRule {
  maxFailures: number;
  windowMs: number;
  lockMs: number;
}

/** The keys among `keys` that are locked at `now`, with the time each lock ends. */
export async function lockedKeys(
  tx: Tx,
  keys: string[],
  now: Date,
): Promise<{ key: string; lockedUntil: Date }[]> {
  const rows = await tx.sequelize.query<{ key: string; locked_until: Date }>(
    'SELECT key, locked_until FROM sign_in_throttles WHERE key = ANY($1) AND locked_until > $2',
    { bind: [keys, now], transaction: tx.transaction, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ key: r.key, lockedUntil: new Date(r.locked_until) }));
}

/**
 * Counts one failed sign-in against `key` in a fixed window; reaching the rule's maximum
 * locks the key for lockMs and starts a new count. Returns the lock's end when this failure
 * caused it.
 */
export async function recordFailure(
  tx: Tx,
  key: string,
  rule: ThrottleRule,
  now: Date,
): Promise<{ lockedUntil: Date | null }> {
  await tx.sequelize.query(
    'INSERT INTO sign_in_throttles (key, window_started_at) VALUES ($1, $2) ON CONFLICT (key) DO NOTHING',
    {
      bind: [key, now],
      transaction: tx.transaction,
    },
  );
  const [row] = await tx.sequelize.query<{
    failures: number;
    window_started_at: Date;
    locked_until: Date | null;
  }>(
    'SELECT failures, window_started_at, locked_until FROM sign_in_throttles WHERE key = $1 FOR UPDATE',
    { bind: [key], transaction: tx.transaction, type: QueryTypes.SELECT },
  );
  if (!row) throw new Error(`throttle row ${key} vanished`);
  const windowOver =
    now.getTime() - new Date(row.window_started_at).getTime() > rule.windowMs ||
    (row.locked_until !== null && new Date(row.locked_until) <= now);
  let failures = windowOver ? 1 : row.failures + 1;
  let windowStartedAt = windowOver ? now : new Date(row.window_started_at);
  let lockedUntil: Date | null = windowOver ? null : row.locked_until && new Date(row.locked_until);
  let newlyLocked: Date | null = null;
  if (failures >= rule.maxFailures) {
    lockedUntil = newlyLocked = new Date(now.getTime() + rule.lockMs);
    failures = 0;
    windowStartedAt = now;
  }
  await tx.sequelize.query(
    'UPDATE sign_in_throttles SET failures = $2, window_started_at = $3, locked_until = $4 WHERE key = $1',
    { bind: [key, failures, windowStartedAt, lockedUntil], transaction: tx.transaction },
  );
  return { lockedUntil: newlyLocked };
}

export async function clearThrottle(tx: Tx, key: string): Promise<void> {
  await tx.sequelize.query('DELETE FROM sign_in_throttles WHERE key = $1', {
    bind: [key],
    transaction: tx.transaction,
  });
}
