import { createHash } from 'node:crypto';

/** The fields an event's hash covers, in the form they are stored. */
export interface ChainedEventContent {
  id: string;
  orgId: string | null;
  seq: number;
  at: Date;
  actorUserId: string | null;
  action: string;
  targetType: string;
  targetId: string | null;
  details: Record<string, unknown>;
  /** Context added by migration 20261202-02; null on events written before it. */
  revision?: string | null;
  summary?: string | null;
  projectId?: string | null;
  worksheetId?: string | null;
  ip?: string | null;
  userAgent?: string | null;
}

/**
 * The context fields enter the hashed JSON only when they hold a value. Events written before
 * these columns existed have NULL there and were hashed without them, so they still verify;
 * a value added to such an event later, or changed on a newer one, breaks its hash.
 */
const contextFields = [
  'revision',
  'summary',
  'projectId',
  'worksheetId',
  'ip',
  'userAgent',
] as const;

/** The first event of a chain links to this value. */
export const GENESIS_HASH = '';

/**
 * JSON with object keys sorted at every depth, so that the same event always serializes to
 * the same bytes (PostgreSQL's jsonb reorders keys; JSON.stringify keeps insertion order).
 */
export function canonicalJson(value: unknown): string {
  if (value === null || typeof value !== 'object') return JSON.stringify(value) ?? 'null';
  if (value instanceof Date) return JSON.stringify(value.toISOString());
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  const entries = Object.entries(value as Record<string, unknown>)
    .filter(([, v]) => v !== undefined)
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
}

/** SHA-256 (hex) over the event's canonical JSON followed by the previous event's hash. */
export function eventHash(event: ChainedEventContent, prevHash: string): string {
  const content = canonicalJson({
    id: event.id,
    orgId: event.orgId,
    seq: event.seq,
    at: event.at.toISOString(),
    actorUserId: event.actorUserId,
    action: event.action,
    targetType: event.targetType,
    targetId: event.targetId,
    details: event.details,
    ...Object.fromEntries(contextFields.flatMap((f) => (event[f] == null ? [] : [[f, event[f]]]))),
  });
  return createHash('sha256').update(content).update(prevHash).digest('hex');
}

export interface StoredChainEvent extends ChainedEventContent {
  prevHash: string;
  hash: string;
}

export interface ChainHead {
  lastSeq: number;
  lastHash: string;
  lastEventId: string | null;
}

export interface ChainVerdict {
  ok: boolean;
  events: number;
  firstBadEventId?: string;
}

/**
 * Walks a chain in sequence order: each event must follow its predecessor without a gap,
 * link to its hash and hash to what it stores; the head must name the last event. The first
 * event that breaks any of these is reported (for a removed tail: the event the head names).
 */
export function verifyChain(events: StoredChainEvent[], head: ChainHead | null): ChainVerdict {
  let prevHash = GENESIS_HASH;
  let expectedSeq = 1;
  for (const event of events) {
    const intact =
      event.seq === expectedSeq &&
      event.prevHash === prevHash &&
      eventHash(event, prevHash) === event.hash;
    if (!intact) return { ok: false, events: events.length, firstBadEventId: event.id };
    prevHash = event.hash;
    expectedSeq += 1;
  }
  const last = events.at(-1);
  const headSeq = head?.lastSeq ?? 0;
  if (headSeq !== (last?.seq ?? 0) || (last && head?.lastHash !== last.hash)) {
    const bad = head?.lastEventId ?? last?.id;
    return bad
      ? { ok: false, events: events.length, firstBadEventId: bad }
      : { ok: false, events: events.length };
  }
  return { ok: true, events: events.length };
}
