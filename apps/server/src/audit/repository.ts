import { QueryTypes } from 'sequelize';
import type { Tx } from '../db/transactions.ts';
import type { ChainHead, StoredChainEvent } from './hash-chain.ts';

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

const eventColumns = `id, org_id, seq, at, actor_user_id, action, target_type, target_id, details,
  prev_hash, hash, revision, summary, project_id, worksheet_id, ip, user_agent`;

interface EventRecord {
  id: string;
  org_id: string | null;
  seq: string;
  at: Date;
  actor_user_id: string | null;
  action: string;
  target_type: string;
  target_id: string | null;
  details: Record<string, unknown>;
  prev_hash: string;
  hash: string;
  revision: string | null;
  summary: string | null;
  project_id: string | null;
  worksheet_id: string | null;
  ip: string | null;
  user_agent: string | null;
}

const toStored = (r: EventRecord): StoredChainEvent => ({
  id: r.id,
  orgId: r.org_id,
  seq: Number(r.seq),
  at: new Date(r.at),
  actorUserId: r.actor_user_id,
  action: r.action,
  targetType: r.target_type,
  targetId: r.target_id,
  details: r.details,
  prevHash: r.prev_hash,
  hash: r.hash,
  revision: r.revision,
  summary: r.summary,
  projectId: r.project_id,
  worksheetId: r.worksheet_id,
  ip: r.ip,
  userAgent: r.user_agent,
});

export async function insertEvent(tx: Tx, chain: ChainKey, e: StoredChainEvent): Promise<void> {
  await tx.sequelize.query(
    `INSERT INTO audit_events (${eventColumns})
     VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9::jsonb, $10, $11, $12, $13, $14, $15, $16, $17)`,
    {
      bind: [
        e.id,
        e.orgId,
        e.seq,
        e.at,
        e.actorUserId,
        e.action,
        e.targetType,
        e.targetId,
        JSON.stringify(e.details),
        e.prevHash,
        e.hash,
        e.revision ?? null,
        e.summary ?? null,
        e.projectId ?? null,
        e.worksheetId ?? null,
        e.ip ?? null,
        e.userAgent ?? null,
      ],
      transaction: tx.transaction,
    },
  );
  await tx.sequelize.query(
    'UPDATE audit_chain_heads SET last_seq = $2, last_hash = $3, last_event_id = $4 WHERE chain = $1',
    { bind: [chain, e.seq, e.hash, e.id], transaction: tx.transaction },
  );
}

/** Every event of one organization's chain, in chain order. */
export async function chainEvents(tx: Tx, orgId: string): Promise<StoredChainEvent[]> {
  const rows = await tx.sequelize.query<EventRecord>(
    `SELECT ${eventColumns} FROM audit_events WHERE org_id = $1 ORDER BY seq`,
    { bind: [orgId], transaction: tx.transaction, type: QueryTypes.SELECT },
  );
  return rows.map(toStored);
}

export interface AuditListFilter {
  action?: string;
  actorUserId?: string;
  projectId?: string;
  worksheetId?: string;
  from?: Date;
  to?: Date;
  /** Null: every matching event (the CSV export). */
  limit: number | null;
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
  revision: string | null;
  summary: string | null;
  project_id: string | null;
  worksheet_id: string | null;
  ip: string | null;
  user_agent: string | null;
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
            e.revision, e.summary, e.project_id, e.worksheet_id, e.ip, e.user_agent,
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
        AND ($8::uuid IS NULL OR e.project_id = $8)
        AND ($9::uuid IS NULL OR e.worksheet_id = $9)
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
        filter.projectId ?? null,
        filter.worksheetId ?? null,
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
