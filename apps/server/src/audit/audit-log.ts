import { randomUUID } from 'node:crypto';
import type { AuditEvent, AuditVerifyResponse } from '@biasproof/shared';
import type { Tx } from '../db/transactions.ts';
import { eventHash, verifyChain } from './hash-chain.ts';
import {
  ACCOUNT_CHAIN,
  chainEvents,
  countOrgEvents,
  insertEvent,
  listOrgEvents,
  lockChainHead,
  readChainHead,
  type AuditListFilter,
} from './repository.ts';

export interface AuditEntry {
  /** Who acted; null when nobody signed in did (a lock after failed sign-ins). */
  actorUserId: string | null;
  /** Dotted name, e.g. `member.roles-changed`. */
  action: string;
  targetType: string;
  targetId: string | null;
  details?: Record<string, unknown>;
}

/**
 * Appends one event to a chain (an organization's, or the account chain when orgId is null)
 * inside the caller's transaction, so the event exists exactly when the change it records
 * does. The chain head stays locked until that transaction ends.
 */
export async function appendAuditEvent(
  tx: Tx,
  orgId: string | null,
  entry: AuditEntry,
): Promise<string> {
  const chain = orgId ?? ACCOUNT_CHAIN;
  const head = await lockChainHead(tx, chain);
  // Round-trip through JSON so the hashed details are exactly what jsonb will hand back.
  const details = JSON.parse(JSON.stringify(entry.details ?? {})) as Record<string, unknown>;
  const content = {
    id: randomUUID(),
    orgId,
    seq: head.lastSeq + 1,
    at: new Date(),
    actorUserId: entry.actorUserId,
    action: entry.action,
    targetType: entry.targetType,
    targetId: entry.targetId,
    details,
  };
  const hash = eventHash(content, head.lastHash);
  await insertEvent(tx, chain, { ...content, prevHash: head.lastHash, hash });
  return content.id;
}

/** Takes an organization's chain lock up front, so a whole write transaction runs alone in its organization. */
export async function lockOrgChain(tx: Tx, orgId: string): Promise<void> {
  await lockChainHead(tx, orgId);
}

export async function listAuditEvents(
  tx: Tx,
  orgId: string,
  filter: AuditListFilter,
): Promise<{ items: AuditEvent[]; total: number }> {
  const rows = await listOrgEvents(tx, orgId, filter);
  const total = rows[0]
    ? Number(rows[0].total)
    : filter.offset > 0
      ? await countOrgEvents(tx, orgId, filter)
      : 0;
  return {
    items: rows.map((r) => ({
      id: r.id,
      at: new Date(r.at).toISOString(),
      actor: r.actor_user_id ? { id: r.actor_user_id, name: r.actor_name ?? '' } : null,
      action: r.action,
      targetType: r.target_type,
      targetId: r.target_id,
      details: r.details,
    })),
    total,
  };
}

/** Recomputes an organization's chain from its first event. */
export async function verifyOrgChain(tx: Tx, orgId: string): Promise<AuditVerifyResponse> {
  const events = await chainEvents(tx, orgId);
  const head = await readChainHead(tx, orgId);
  return verifyChain(events, head);
}
