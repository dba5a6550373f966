import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import {
  canonicalJson,
  eventHash,
  GENESIS_HASH,
  verifyChain,
  type StoredChainEvent,
} from '../hash-chain.ts';

function chain(n: number): StoredChainEvent[] {
  const events: StoredChainEvent[] = [];
  let prev = GENESIS_HASH;
  for (let i = 1; i <= n; i += 1) {
    const content = {
      id: `e${i}`,
      orgId: 'org',
      seq: i,
      at: new Date(Date.UTC(2026, 11, 1, 9, i)),
      actorUserId: 'u1',
      action: 'member.roles-changed',
      targetType: 'user',
      targetId: 'u2',
      details: { roles: ['author'], n: i },
    };
    const hash = eventHash(content, prev);
    events.push({ ...content, prevHash: prev, hash });
    prev = hash;
  }
  return events;
}
const headOf = (events: StoredChainEvent[]) => ({
  lastSeq: events.length,
  lastHash: events.at(-1)!.hash,
  lastEventId: events.at(-1)!.id,
});

describe('audit hash chain', () => {
  it('when keys come in another order, then the canonical JSON is the same', () => {
    expect(canonicalJson({ b: 1, a: { d: [2, { y: 1, x: 2 }], c: null } })).toBe(
      '{"a":{"c":null,"d":[2,{"x":2,"y":1}]},"b":1}',
    );
    expect(canonicalJson({ a: 1, b: undefined })).toBe('{"a":1}');
  });

  it('when the hash is computed, then it is SHA-256 over the canonical JSON followed by the previous hash', () => {
    const [first] = chain(1);
    expect(first!.hash).toMatch(/^[0-9a-f]{64}$/);
    expect(eventHash({ ...first!, details: { n: 1, roles: ['author'] } }, GENESIS_HASH)).toBe(
      first!.hash,
    );
    expect(eventHash(first!, 'x')).not.toBe(first!.hash);
  });

  it('when the chain is intact, then it verifies', () => {
    const events = chain(4);
    expect(verifyChain(events, headOf(events))).toEqual({ ok: true, events: 4 });
    expect(verifyChain([], null)).toEqual({ ok: true, events: 0 });
  });

  it.each([
    [
      'a detail is edited',
      (e: StoredChainEvent[]) => (e[2]!.details = { roles: ['admin'], n: 3 }),
      'e3',
    ],
    ['an event is removed from the middle', (e: StoredChainEvent[]) => e.splice(1, 1), 'e3'],
    ['two events swap places', (e: StoredChainEvent[]) => ([e[1], e[2]] = [e[2]!, e[1]!]), 'e3'],
    [
      'a hash is recomputed without its successor',
      (e: StoredChainEvent[]) => {
        e[1]!.action = 'member.removed';
        e[1]!.hash = eventHash(e[1]!, e[1]!.prevHash);
      },
      'e3',
    ],
  ])('when %s, then verification names the first bad event', (_what, tamper, bad) => {
    const events = chain(4);
    const head = headOf(events);
    tamper(events);
    expect(verifyChain(events, head)).toEqual({
      ok: false,
      events: events.length,
      firstBadEventId: bad,
    });
  });

  it('when the last event is removed, then the head gives it away', () => {
    const events = chain(3);
    const head = headOf(events);
    expect(verifyChain(events.slice(0, 2), head)).toEqual({
      ok: false,
      events: 2,
      firstBadEventId: 'e3',
    });
  });

  it('when an event was hashed before the context columns existed, then it still verifies with those fields null', () => {
    // The hash as the code before migration 20261202-02 computed it, written out again here.
    const legacy = {
      id: 'old',
      orgId: 'org',
      seq: 1,
      at: new Date(Date.UTC(2026, 11, 1, 8)),
      actorUserId: 'u1',
      action: 'member.added',
      targetType: 'user',
      targetId: 'u2',
      details: { roles: ['author'] },
    };
    const oldHash = createHash('sha256')
      .update(canonicalJson({ ...legacy, at: legacy.at.toISOString() }))
      .update(GENESIS_HASH)
      .digest('hex');
    const stored: StoredChainEvent = {
      ...legacy,
      revision: null,
      summary: null,
      projectId: null,
      worksheetId: null,
      ip: null,
      userAgent: null,
      prevHash: GENESIS_HASH,
      hash: oldHash,
    };

    expect(verifyChain([stored], { lastSeq: 1, lastHash: oldHash, lastEventId: 'old' })).toEqual({
      ok: true,
      events: 1,
    });
    // A value put into a context field of such an event afterwards breaks its hash.
    expect(eventHash({ ...stored, summary: 'Added nobody' }, GENESIS_HASH)).not.toBe(oldHash);
  });

  it.each(['revision', 'summary', 'projectId', 'worksheetId', 'ip', 'userAgent'] as const)(
    'when the context field %s of an event changes, then its hash changes',
    (field) => {
      const [first] = chain(1);
      const withContext = {
        ...first!,
        revision: 'A',
        summary: 'Submitted "Mic preamp" revision A for check',
        projectId: 'p1',
        worksheetId: 'w1',
        ip: '192.0.2.10',
        userAgent: 'Bench browser 1.0',
      };
      const hash = eventHash(withContext, GENESIS_HASH);

      expect(eventHash({ ...withContext, [field]: 'other' }, GENESIS_HASH)).not.toBe(hash);
      expect(eventHash({ ...withContext, [field]: null }, GENESIS_HASH)).not.toBe(hash);
    },
  );
});
