import { QueryTypes } from 'sequelize';
import type { Tx } from '../db/transactions.ts';
import type { AuditEventAttributes } from '../db/models/audit-event.ts';
import type { ChainHead } from './hash-chain.ts';

/** The chain an event belongs to: an organization's id, or `account` for account events. */
export type ChainKey = string;
export const ACCOUNT_CHAIN: ChainKey = 'account';

/**
 * Locks a chain's head row for the rest of the transaction (creating it on first use), so
 * appends to one chain happen one after another and each sees the true last hash.
 */
export async function lockChainHead(tx: Tx, chain: ChainKey): Promise<ChainHead> {
  await tx.sequelize.query(
    'INSERT INTO audit_chain_heads (chain) VALUES ($1) ON CONFLICT (chain) DO NOTHING',
    {
      bind: [chain],
      transaction: tx.transaction,
    },
  );
  const [row] = await tx.sequelize.query<{
    last_seq: string;
    last_hash: string;
    last_event_id: string | null;
  }>(
    'SELECT last_seq, last_hash, last_event_id FROM audit_chain_heads WHERE chain = $1 FOR UPDATE',
    { bind: [chain], transaction: tx.transaction, type: QueryTypes.SELECT },
  );
  if (!row) throw new Error(`audit chain head ${chain} could not be locked`);
  return { lastSeq: Number(row.last_seq), lastHash: row.last_hash, lastEventId: row.last_event_id };
}

export async function readChainHead(tx: Tx, chain: ChainKey): Promise<ChainHead | null> {
  const [row] = await tx.sequelize.query<{
    last_seq: string;
    last_hash: string;
    last_event_id: string | null;
  }>('SELECT last_seq, last_hash, last_event_id FROM audit_chain_heads WHERE chain = $1', {
    bind: [chain],
    transaction: tx.transaction,
    type: QueryTypes.SELECT,
  });
  return row
    ? { lastSeq: Number(row.last_seq), lastHash: row.last_hash, lastEventId: row.last_event_id }
    : null;
}

export async function insertEvent(
  tx: Tx,
  chain: ChainKey,
  event: AuditEventAttributes,
): Promise<void> {
  await tx.models.AuditEvent.create(event, { transaction: tx.transaction });
  await tx.sequelize.query(
    'UPDATE audit_chain_heads SET last_seq = $2, last_hash = $3, last_event_id = $4 WHERE chain = $1',
    { bind: [chain, event.seq, event.hash, event.id], transaction: tx.transaction },
  );
}

/** Every event of one organization's chain, in chain order. */
export async function chainEvents(tx: Tx, orgId: string): Promise<AuditEventAttributes[]> {
  const rows = await tx.models.AuditEvent.findAll({
    where: { orgId },
    order: [['seq', 'ASC']],
    transaction: tx.transaction,
  });
  return rows.map((r) => r.get({ plain: true }));
}

export interface AuditListFilter {
  action?: string;
  actorUserId?: string;
  from?: Date;
  to?: Date;
  limit: number;
  offset: number;
}

export interface AuditListRow {
  id: string;
  at: Date;
  actor_user_id: string | null;
  actor_name: string | null;
  action: string;
  target_type: string;
  target_id: string | null;
  details: Record<string, unknown>;
  total: string;
}

/**
 * One organization's events, newest first, together with the account events (sign-ins,
 * password changes, locks) of the people who are its members now.
 */
export async function listOrgEvents(
  tx: Tx,
  orgId: string,
  filter: AuditListFilter,
): Promise<AuditListRow[]> {
  return tx.sequelize.query<AuditListRow>(
    `SELECT e.id, e.at, e.actor_user_id, u.name AS actor_name, e.action, e.target_type, e.target_id, e.details,
            count(*) OVER () AS total
       FROM audit_events e
       LEFT JOIN users u ON u.id = e.actor_user_id
      WHERE (e.org_id = $1
             OR (e.org_id IS NULL AND e.target_type = 'user'
                 AND e.target_id IN (SELECT m.user_id::text FROM memberships m WHERE m.org_id = $1)))
        AND ($2::text IS NULL OR e.action = $2)
        AND ($3::uuid IS NULL OR e.actor_user_id = $3)
        AND ($4::timestamptz IS NULL OR e.at >= $4)
        AND ($5::timestamptz IS NULL OR e.at <= $5)
      ORDER BY e.at DESC, e.seq DESC
      LIMIT $6 OFFSET $7`,
    {
      bind: [
        orgId,
        filter.action ?? null,
        filter.actorUserId ?? null,
        filter.from ?? null,
        filter.to ?? null,
        filter.limit,
        filter.offset,
      ],
      transaction: tx.transaction,
      type: QueryTypes.SELECT,
    },
  );
}

export async function countOrgEvents(
  tx: Tx,
  orgId: string,
  filter: AuditListFilter,
): Promise<number> {
  const rows = await listOrgEvents(tx, orgId, { ...filter, limit: 1, offset: 0 });
  return rows[0] ? Number(rows[0].total) : 0;
}
