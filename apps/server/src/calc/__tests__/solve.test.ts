import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { computeWorksheet } from '@biasproof/calc';
import {
  canonicalJson,
  encodeResults,
  MAX_DRAFT_BYTES,
  storedResultsSchema,
} from '@biasproof/shared';
import { createTestApp } from '../../test-support/test-app.ts';
import {
  anonymousAgent,
  createOrgWithMembers,
  signIn,
  type SignedInAgent,
} from '../../test-support/fixtures.ts';
import { dividerDraft, idealMosDraft } from '../../worksheets/__tests__/worksheet-drafts.ts';
import { contentHash } from '../compute.ts';

describe('POST /api/calc/solve', () => {
  const t = createTestApp();
  let checker: SignedInAgent;
  beforeAll(async () => {
    const { people } = await createOrgWithMembers(t, { kim: ['checker'] });
    checker = await signIn(t, people.kim!);
  });
  afterAll(() => t.close());

  const solve = (who: SignedInAgent, body: unknown) =>
    who.agent
      .post('/api/calc/solve')
      .set('x-csrf-token', who.csrf)
      .send(body as object);

  it('when a signed-in person sends a draft, then it answers the engine’s results with non-finite numbers as strings', async () => {
    const draft = idealMosDraft();

    const res = await solve(checker, draft);

    expect(res.status).toBe(200);
    expect(canonicalJson(res.body)).toBe(canonicalJson(encodeResults(computeWorksheet(draft))));
    expect(res.body.devices.value.m1.ro).toBe('Infinity');
    const parsed = storedResultsSchema.parse(res.body) as unknown as {
      devices: { value: { m1: { ro: number } } };
    };
    expect(parsed.devices.value.m1.ro).toBe(Infinity);
  });

  it('when settings are left out, then the engine’s defaults apply', async () => {
    const res = await solve(checker, { circuit: dividerDraft().circuit });
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('solved');
    expect(res.body.smallSignal).toEqual({
      ok: false,
      missing: 'Choose the input source in the analysis settings.',
    });
  });

  it('when signed out, then it answers 401', async () => {
    const anonymous = await anonymousAgent(t);
    const res = await solve(anonymous, dividerDraft());
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });

  it('when the circuit has more than 500 elements, then it answers 400 naming the field', async () => {
    const elements = Array.from({ length: 501 }, (_, i) => ({
      kind: 'R',
      name: `R${i}`,
      nodes: ['a', '0'],
      value: 1e3,
    }));
    const res = await solve(checker, { circuit: { elements } });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({
      'circuit.elements': 'A circuit has at most 500 elements.',
    });
  });

  it('when the body is larger than 256 kB, then it answers 413 without solving', async () => {
    const body = { circuit: { title: 'x'.repeat(MAX_DRAFT_BYTES), elements: [] } };
    const res = await solve(checker, body);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('payload-too-large');
  });

  it('when the same content is hashed in any key order, then the content hash is the same 64 hex digits', () => {
    const { circuit, settings } = dividerDraft();
    const results = encodeResults(computeWorksheet({ circuit, settings }));
    const reordered = JSON.parse(JSON.stringify({ settings, results, circuit })) as {
      circuit: unknown;
      settings: unknown;
      results: unknown;
    };
    const a = contentHash({ circuit, settings, results });
    expect(a).toMatch(/^[0-9a-f]{64}$/);
    expect(contentHash(reordered)).toBe(a);
    expect(contentHash({ circuit, settings: { ...settings, temperature: 28 }, results })).not.toBe(
      a,
    );
  });
});
