import { describe, expect, it } from 'vitest';
import {
  analysisSettingsSchema,
  computeWorksheet,
  parseDeck,
  runMonteCarlo,
  worksheetDraftSchema,
  type SolvedWorksheet,
  type WorksheetDraft,
} from '../src/index.ts';

// The worksheet's variation section: optional, so settings stored before it parse and compute
// as they did; present, it adds results.variation whose parts are the standalone functions'
// own answers (the reference here), Monte Carlo included only up to 2000 samples.

const ce = parseDeck(
  'ce\nVCC vcc 0 12\nVS s 0 0 AC 1\nCS s b 10u\nR1 vcc b 56k\nR2 b 0 12k\nRC vcc c 3.9k\nRE e 0 1k\nCE e 0 100u\nQ1 c b e QN\n.model QN NPN (IS=2e-15 BF=180 VAF=90)\n.end\n',
).circuit;
const parameters = [
  ...['r1', 'r2', 'rc', 're'].map((target) => ({ target, tolerancePercent: 1 })),
  { target: 'qn.bf', tolerancePercent: 30 },
];

function draft(variation?: unknown): WorksheetDraft {
  return worksheetDraftSchema.parse({
    circuit: ce,
    settings: {
      inputSource: 'VS',
      outputNode: 'c',
      ...(variation === undefined ? {} : { variation }),
    },
  });
}

function solved(d: WorksheetDraft): SolvedWorksheet {
  const r = computeWorksheet(d);
  if (r.status !== 'solved') throw new Error(`expected solved, got ${r.status}`);
  return r;
}

describe('settings without a variation section', () => {
  it('parse without one and compute no variation results', () => {
    expect(analysisSettingsSchema.parse({})).not.toHaveProperty('variation');
    expect(solved(draft())).not.toHaveProperty('variation');
  });
  it('an empty section takes every default', () => {
    expect(analysisSettingsSchema.parse({ variation: {} }).variation).toMatchObject({
      parameters: [],
      temperatures: [],
      limits: [],
      monteCarlo: { samples: 0, seed: '1' },
      standardSeries: ['E24', 'E96'],
      policy: { resistorPower: { factor: 0.6 } },
    });
  });
  it('when the section asks for more than 100 000 samples, then parsing fails with that message', () => {
    const r = analysisSettingsSchema.safeParse({ variation: { monteCarlo: { samples: 100_001 } } });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0]?.message).toBe('samples must be at most 100000');
  });
});

describe('a worksheet with a variation section', () => {
  const limits = [
    { path: 'nodes.c', min: 6, max: 7.5, unit: 'V' },
    { path: 'gain.db', min: 40, unit: 'dB' },
  ];
  const variation = {
    parameters,
    temperatures: [-40, 27, 85],
    limits,
    handChecks: [
      {
        path: 'devices.q1.ic',
        expected: 1.35e-3,
        tolerancePercent: 10,
        note: 'IC ≈ (VB − 0.7)/RE',
      },
    ],
    ratings: [{ element: 'q1', power: 0.625, current: 0.2, voltage: 40 }],
    monteCarlo: { samples: 400, seed: 'worksheet' },
  };
  const r = solved(draft(variation));
  const v = r.variation!;

  it('follows the limit and hand-check paths, valued from the worksheet’s own results', () => {
    expect(v.probes).toEqual(['nodes.c', 'gain.db', 'devices.q1.ic']);
    expect(v.nominal['nodes.c']).toBe(r.bias.nodes.c);
    expect(v.nominal['gain.db']).toBe(r.smallSignal.ok ? r.smallSignal.value.gain.db : NaN);
  });
  it('checks each limit at nominal, at its worst corner and as Monte Carlo yield', () => {
    expect(v.limits).toHaveLength(2);
    for (const row of v.limits) {
      expect(row.nominal.value).not.toBeNull();
      expect(row.worstCorner?.value).not.toBeNull();
      expect(row.yield).toBeGreaterThanOrEqual(0);
    }
    expect(v.limits[0]!.worstCorner!.margin!).toBeLessThanOrEqual(v.limits[0]!.nominal.margin!);
  });
  it('stores the Monte Carlo run that runMonteCarlo gives for the same seed', () => {
    expect(v.monteCarlo.ok).toBe(true);
    const reference = runMonteCarlo({
      circuit: ce,
      settings: { inputSource: 'VS', outputNode: 'c' },
      parameters,
      samples: 400,
      seed: 'worksheet',
      probes: v.probes,
      limits,
    });
    expect(v.monteCarlo.ok && v.monteCarlo.value).toEqual(reference);
  });
  it('reports corners, RSS, temperatures, stress, standard values and the hand check', () => {
    expect(v.corners.ok && v.corners.value.method).toBe('exhaustive');
    expect(v.rss.ok && v.rss.value.probes['nodes.c']!.sigma).toBeGreaterThan(0);
    expect(v.temperatures.ok && v.temperatures.value.points.map((p) => p.temperature)).toEqual([
      -40, 27, 85,
    ]);
    expect(v.stress.ok && v.stress.value.rows.find((x) => x.element === 'q1')?.status).toBe('pass');
    expect(v.standardValues.ok && Object.keys(v.standardValues.value.recomputed)).toEqual([
      'E24',
      'E96',
    ]);
    expect(v.handChecks[0]).toMatchObject({
      path: 'devices.q1.ic',
      expected: 1.35e-3,
      actual: r.bias.devices.q1 && 'ic' in r.bias.devices.q1 ? r.bias.devices.q1.ic : null,
    });
  });
  it('is the same on every computation (the stored hash depends on it)', () => {
    expect(JSON.stringify(solved(draft(variation)))).toBe(JSON.stringify(r));
  });
  it('when Monte Carlo asks for more than 2000 samples, then the stored results say it runs in the view', () => {
    const big = solved(draft({ ...variation, monteCarlo: { samples: 5000, seed: 1 } })).variation!;
    expect(big.monteCarlo).toEqual({
      ok: false,
      missing:
        'Monte Carlo of 5000 samples runs in the variation view; the stored results hold runs of up to 2000.',
    });
    expect(big.limits[0]!.yield).toBeNull();
  });
});
