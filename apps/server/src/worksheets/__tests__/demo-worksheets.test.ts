import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { computeWorksheet, ENGINE_VERSION, worksheetDraftSchema } from '@biasproof/calc';
import { canonicalJson, encodeResults } from '@biasproof/shared';
import { createTestApp } from '../../test-support/test-app.ts';
import { signIn, systemRows } from '../../test-support/fixtures.ts';
import { contentHash } from '../../calc/compute.ts';
// The demo scenario lives in the seed workspace; loading it here checks it against the real API.
import { demoSteps } from '../../../../../seed/src/demo-steps.ts';
import { DEMO_PASSWORD } from '../../../../../seed/src/demo-organizations.ts';

interface Item {
  id: string;
  title: string;
  projectCode: string;
  resultStatus: string;
  author: { name: string };
  checker: { name: string } | null;
}

describe('demo worksheets', () => {
  const t = createTestApp();
  let items: Item[];
  let read: (path: string) => Promise<{ status: number; body: Record<string, unknown> }>;
  beforeAll(async () => {
    for (const step of demoSteps) await step.load(t.sequelize, t.config);
    const kofi = await signIn(t, {
      email: 'kofi.mensah@quietline.example',
      password: DEMO_PASSWORD,
    });
    const me = await kofi.agent.get('/api/auth/me');
    const orgId = (me.body.memberships as { orgId: string; orgSlug: string }[]).find(
      (m) => m.orgSlug === 'quietline-analog',
    )!.orgId;
    read = (path) => kofi.agent.get(`/api/orgs/${orgId}${path}`);
    items = (await read('/worksheets?limit=100&sort=title')).body.items as Item[];
  });
  afterAll(() => t.close());

  it('when the demo is loaded, then Quietline Analog has at least 8 worksheets in 2 projects, all solved, by its authors', () => {
    expect(items.length).toBeGreaterThanOrEqual(8);
    expect(new Set(items.map((i) => i.projectCode))).toEqual(new Set(['TWH', 'FSG']));
    expect(items.map((i) => i.resultStatus)).toEqual(items.map(() => 'solved'));
    expect(new Set(items.map((i) => i.author.name))).toEqual(
      new Set(['Tomas Lindqvist', 'Priya Raman']),
    );
    expect(items.some((i) => i.checker?.name === 'Kofi Mensah')).toBe(true);
  });

  it('when each demo worksheet is read, then its stored results equal the engine’s results for its stored draft (the preview), with a matching hash', async () => {
    for (const item of items) {
      const res = await read(`/worksheets/${item.id}`);
      const revision = res.body.currentRevision as {
        circuit: unknown;
        settings: unknown;
        results: { smallSignal: { ok: boolean } };
        contentHash: string;
        engineVersion: string;
      };
      const draft = worksheetDraftSchema.parse({
        circuit: revision.circuit,
        settings: revision.settings,
      });
      expect(canonicalJson(revision.results), item.title).toBe(
        canonicalJson(encodeResults(computeWorksheet(draft))),
      );
      expect(revision.contentHash).toBe(contentHash(revision));
      expect(revision.engineVersion).toBe(ENGINE_VERSION);
      expect(revision.results.smallSignal.ok, `${item.title}: small-signal`).toBe(true);
    }
  });

  it('when the demo circuits are taken together, then they cover diodes, NPN and PNP transistors, MOSFETs, and one saturated transistor', async () => {
    const devices = await systemRows<{
      title: string;
      name: string;
      kind: string;
      polarity: string | null;
      region: string;
    }>(
      t,
      `SELECT w.title, d.key AS name, d.value ->> 'kind' AS kind, d.value ->> 'polarity' AS polarity,
              d.value ->> 'region' AS region
         FROM worksheets w JOIN revisions r ON r.worksheet_id = w.id AND r.letter = w.current_revision
         CROSS JOIN LATERAL jsonb_each(r.results -> 'bias' -> 'devices') AS d
        WHERE w.id = ANY ($1)`,
      [items.map((i) => i.id)],
    );
    const kinds = new Set(devices.map((d) => `${d.kind}${d.polarity ?? ''}`));
    expect(kinds).toEqual(new Set(['D', 'QNPN', 'QPNP', 'MNMOS']));
    const saturated = devices.filter((d) => d.kind === 'Q' && d.region === 'saturation');
    expect(saturated.map((d) => d.title)).toEqual([
      'Excitation monitor gain stage (NPN common-emitter)',
    ]);
  });

  it('when the demo is loaded, then the model library holds its example models', async () => {
    const res = await read('/models');
    expect((res.body.items as { name: string }[]).map((m) => m.name)).toEqual([
      'QLN2',
      'QLP2',
      'QNM1',
      'QSW1',
    ]);
  });
});
