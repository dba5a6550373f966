import { randomUUID } from 'node:crypto';
import type { AuditEvent, AuditVerifyResponse } from '@biasproof/shared';
import type { Tx } from '../db/transactions.ts';
import { eventHash, verifyChain, type ChainedEventContent } from './hash-chain.ts';
import { currentRequestContext } from './request-context.ts';
import { describeAuditEvent } from './summaries.ts';
import { findPersonName, findProjectLabel, findWorksheetContext } from './subject-lookups.ts';
import {
  ACCOUNT_CHAIN,
  chainEvents,
  countOrgEvents,
  insertEvent,
  listOrgEvents,
  lockChainHead,
  readChainHead,
  type AuditListFilter,
  type AuditListRow,
} from './repository.ts';

export interface AuditEntry {
  /** Who acted; null when nobody signed in did (a lock after failed sign-ins). */
  actorUserId: string | null;
  /** Dotted name, e.g. `member.roles-changed`. */
  action: string;
  targetType: string;
  targetId: string | null;
  details?: Record<string, unknown>;
  /** The line a person reads; derived from the action and details when absent. */
  summary?: string;
  /**
   * The worksheet, its project and revision the event concerns. When absent they are taken
   * from a `worksheet` target or `details.worksheetId` / `details.projectId` /
   * `details.revision`, and the project from the worksheet.
   */
  worksheetId?: string;
  projectId?: string;
  revision?: string;
}

const stringOr = (v: unknown): string | null => (typeof v === 'string' && v ? v : null);
// Ids are looked up only when well-formed: a malformed one would abort the caller's transaction.
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const uuidOr = (v: unknown): string | null => {
  const s = stringOr(v);
  return s && UUID.test(s) ? s : null;
};

/** Fills the worksheet, project, revision and summary of an entry from what it names. */
async function contextOf(
  tx: Tx,
  entry: AuditEntry,
  details: Record<string, unknown>,
): Promise<Pick<ChainedEventContent, 'revision' | 'summary' | 'projectId' | 'worksheetId'>> {
  const worksheetId = uuidOr(
    entry.worksheetId ?? (entry.targetType === 'worksheet' ? entry.targetId : details.worksheetId),
  );
  const worksheet = worksheetId ? await findWorksheetContext(tx, worksheetId) : null;
  const projectId = uuidOr(
    entry.projectId ??
      worksheet?.projectId ??
      (entry.targetType === 'project' ? entry.targetId : details.projectId),
  );
  const revision = entry.revision ?? stringOr(details.revision);
  const personId = entry.targetType === 'user' ? uuidOr(entry.targetId) : null;
  const summary =
    entry.summary ??
    describeAuditEvent({
      action: entry.action,
      details,
      revision,
      worksheetTitle: worksheet?.title ?? null,
      projectLabel:
        !worksheet && projectId && entry.targetType === 'project'
          ? await findProjectLabel(tx, projectId)
          : null,
      personName: personId ? await findPersonName(tx, personId) : null,
    });
  return { revision, summary, projectId, worksheetId };
}

/**
 * Appends one event to a chain (an organization's, or the account chain when orgId is null)
 * inside the caller's transaction, so the event exists exactly when the change it records
 * does. The chain head stays locked until that transaction ends. The client's address and
 * user agent come from the request being served (request-context.ts), if any.
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
  const client = currentRequestContext();
  const content: ChainedEventContent = {
    id: randomUUID(),
    orgId,
    seq: head.lastSeq + 1,
    at: new Date(),
    actorUserId: entry.actorUserId,
    action: entry.action,
    targetType: entry.targetType,
    targetId: entry.targetId,
    details,
    ...(await contextOf(tx, entry, details)),
    ip: client?.ip ?? null,
    userAgent: client?.userAgent ?? null,
  };
  const hash = eventHash(content, head.lastHash);
  await insertEvent(tx, chain, { ...content, prevHash: head.lastHash, hash });
  return content.id;
}

/** Takes an organization's chain lock up front, so a whole write transaction runs alone in its organization. */
export async function lockOrgChain(tx: Tx, orgId: string): Promise<void> {
  await lockChainHead(tx, orgId);
}

function toAuditEvent(r: AuditListRow): AuditEvent {
  return {
    id: r.id,
    at: new Date(r.at).toISOString(),
    actor: r.actor_user_id ? { id: r.actor_user_id, name: r.actor_name ?? '' } : null,
    action: r.action,
    targetType: r.target_type,
    targetId: r.target_id,
    revision: r.revision,
    // Events from before summaries were stored get the line they would have had.
    summary:
      r.summary ??
      describeAuditEvent({ action: r.action, details: r.details, revision: r.revision }),
    projectId: r.project_id,
    worksheetId: r.worksheet_id,
    ip: r.ip,
    userAgent: r.user_agent,
    details: r.details,
  };
}

export async function listAuditEvents(
  tx: Tx,
  orgId: string,
  filter: AuditListFilter & { limit: number },
): Promise<{ items: AuditEvent[]; total: number }> {
  const rows = await listOrgEvents(tx, orgId, filter);
  const total = rows[0]
    ? Number(rows[0].total)
    : filter.offset > 0
      ? await countOrgEvents(tx, orgId, filter)
      : 0;
  return { items: rows.map(toAuditEvent), total };
}

/** Every event matching the filter, newest first, without paging (the CSV export). */
export async function allAuditEvents(
  tx: Tx,
  orgId: string,
  filter: Omit<AuditListFilter, 'limit' | 'offset'>,
): Promise<AuditEvent[]> {
  const rows = await listOrgEvents(tx, orgId, { ...filter, limit: null, offset: 0 });
  return rows.map(toAuditEvent);
}

/** Recomputes an organization's chain from its first event. */
export async function verifyOrgChain(tx: Tx, orgId: string): Promise<AuditVerifyResponse> {
  const events = await chainEvents(tx, orgId);
  const head = await readChainHead(tx, orgId);
  return verifyChain(events, head);
}
