import { describe, expect, it } from 'vitest';
import { analysisSettingsSchema, computeWorksheet, parseDeck } from '@biasproof/calc';
import { encodeResults } from '../api/canonical-json.ts';
import {
  diffRevisions,
  flattenInputs,
  flattenResults,
  revisionValues,
  samePathValue,
  valueAtPath,
} from '../revision-diff.ts';

const dividerSettings = analysisSettingsSchema.parse({ inputSource: 'V1', outputNode: 'out' });

const pair = (a: string, b: string): [string, string] => [a, b];

/** A 5 V divider, R1 = 1 kΩ over R2 (and R3 in parallel with R2 when given). */
function divider(letter: string, r2: number, r3?: number) {
  const circuit = {
    title: 'divider',
    elements: [
      { kind: 'V' as const, name: 'V1', nodes: pair('in', '0'), dc: 5 },
      { kind: 'R' as const, name: 'R1', nodes: pair('in', 'out'), value: 1000 },
      { kind: 'R' as const, name: 'R2', nodes: pair('out', '0'), value: r2 },
      ...(r3 ? [{ kind: 'R' as const, name: 'R3', nodes: pair('out', '0'), value: r3 }] : []),
    ],
    models: [],
  };
  const results = encodeResults(computeWorksheet({ circuit, settings: dividerSettings }));
  return { letter, circuit, settings: dividerSettings, results };
}

const entry = (diff: ReturnType<typeof diffRevisions>, path: string) =>
  [...diff.inputs, ...diff.results].find((e) => e.path === path);

describe('revision diff', () => {
  it('when R2 of a 5 V divider goes from 1 kΩ to 660 Ω, then the input and every moved result are listed with delta and relative change', () => {
    const diff = diffRevisions(divider('A', 1000), divider('B', 660));

    expect(diff).toMatchObject({ from: 'A', to: 'B', tolerance: 1e-9 });
    expect(diff.inputs).toEqual([
      {
        path: 'elements.r2.value',
        change: 'changed',
        before: 1000,
        after: 660,
        delta: -340,
        relative: -0.34,
      },
    ]);
    // Reference: the unloaded divider, Vout = Vin·R2/(R1+R2), I = Vin/(R1+R2) (Ohm's law).
    const out = entry(diff, 'results.nodes.out');
    expect(out?.before).toBeCloseTo(2.5, 12);
    expect(out?.after).toBeCloseTo((5 * 660) / 1660, 12);
    expect(out?.delta).toBeCloseTo((5 * 660) / 1660 - 2.5, 12);
    expect(out?.relative).toBeCloseTo(((5 * 660) / 1660 - 2.5) / 2.5, 12);
    const current = entry(diff, 'results.elements.r2.current');
    expect(current?.before).toBeCloseTo(5 / 2000, 15);
    expect(current?.after).toBeCloseTo(5 / 1660, 15);
    // SPICE convention: a supply delivering power shows a negative current.
    expect(entry(diff, 'results.sources.v1')?.after).toBeCloseTo(-5 / 1660, 15);
    expect(entry(diff, 'results.supplyPower')?.after).toBeCloseTo(25 / 1660, 15);
    // Small signal at 1 kHz of the same divider: gain R2/(R1+R2), Zin = R1+R2, Zout = R1‖R2.
    expect(entry(diff, 'results.gain.vv')?.after).toBeCloseTo(660 / 1660, 12);
    expect(entry(diff, 'results.zin.ohm')?.after).toBeCloseTo(1660, 9);
    expect(entry(diff, 'results.zout.ohm')?.after).toBeCloseTo((1000 * 660) / 1660, 9);
    // The input node sits on the 5 V source in both: not a change.
    expect(entry(diff, 'results.nodes.in')).toBeUndefined();
    expect(diff.results.map((e) => e.path)).toEqual([...diff.results.map((e) => e.path)].sort());
  });

  it('when an element is added, then each of its inputs is listed as added with before null', () => {
    const diff = diffRevisions(divider('A', 1000), divider('B', 1000, 2000));
    expect(diff.inputs).toEqual([
      { path: 'elements.r3.kind', change: 'added', before: null, after: 'R' },
      { path: 'elements.r3.nodes', change: 'added', before: null, after: 'out 0' },
      { path: 'elements.r3.value', change: 'added', before: null, after: 2000 },
    ]);
    expect(entry(diff, 'results.elements.r3.current')).toMatchObject({
      change: 'added',
      before: null,
    });
    const back = diffRevisions(divider('B', 1000, 2000), divider('C', 1000));
    expect(back.inputs.map((e) => [e.path, e.change, e.after])).toEqual([
      ['elements.r3.kind', 'removed', null],
      ['elements.r3.nodes', 'removed', null],
      ['elements.r3.value', 'removed', null],
    ]);
  });

  it('when two revisions have the same content, then nothing is listed', () => {
    const diff = diffRevisions(divider('A', 1000), divider('B', 1000));
    expect(diff.inputs).toEqual([]);
    expect(diff.results).toEqual([]);
  });

  it('when a result moves by less than the tolerance, then it is left out; by more, it is listed', () => {
    const rev = (letter: string, vout: number, ic: number) => ({
      letter,
      circuit: { elements: [] },
      settings: {},
      results: {
        status: 'solved',
        bias: { nodes: { out: vout }, devices: { q1: { kind: 'Q', ic } } },
      },
    });
    const diff = diffRevisions(rev('A', 2.5, 1e-3), rev('B', 2.5 * (1 + 1e-12), 1e-3 * (1 + 1e-6)));
    expect(diff.results.map((e) => e.path)).toEqual(['results.devices.q1.ic']);
    expect(diff.results[0]?.relative).toBeCloseTo(1e-6, 12);
  });

  it('when a model parameter and a setting change, then they are named by model and setting', () => {
    const base = {
      title: '',
      elements: [],
      models: [{ name: 'QN', kind: 'NPN', params: { BF: 100 } }],
    };
    const diff = diffRevisions(
      { letter: 'A', circuit: base, settings: { temperature: 27 }, results: { status: 'empty' } },
      {
        letter: 'B',
        circuit: { ...base, models: [{ name: 'QN', kind: 'NPN', params: { BF: 150 } }] },
        settings: { temperature: 85 },
        results: { status: 'empty' },
      },
    );
    expect(diff.inputs).toEqual([
      {
        path: 'models.qn.BF',
        change: 'changed',
        before: 100,
        after: 150,
        delta: 50,
        relative: 0.5,
      },
      {
        path: 'settings.temperature',
        change: 'changed',
        before: 27,
        after: 85,
        delta: 58,
        relative: 58 / 27,
      },
    ]);
  });

  it('when a number turns infinite, then it is a change without delta; stored "Infinity" and the number Infinity are the same', () => {
    const rev = (letter: string, ro: unknown) => ({
      letter,
      circuit: {},
      settings: {},
      results: { status: 'solved', bias: { devices: { m1: { kind: 'M', ro } } } },
    });
    expect(diffRevisions(rev('A', 'Infinity'), rev('B', Infinity)).results).toEqual([]);
    expect(diffRevisions(rev('A', 5e4), rev('B', 'Infinity')).results).toEqual([
      { path: 'results.devices.m1.ro', change: 'changed', before: 50000, after: 'Infinity' },
    ]);
  });
});

describe('values at a finding path', () => {
  const stage = () => {
    const { circuit } = parseDeck(
      [
        'NPN common-emitter stage',
        'VCC vcc 0 DC 12',
        'VS src 0 DC 0 AC 1',
        'CIN src b 10u',
        'R1 vcc b 47k',
        'R2 b 0 10k',
        'RC vcc c 4.7k',
        'Q1 c b e QN',
        'RE e 0 1k',
        'D1 c x DX',
        'RX x 0 1meg',
        '.model QN NPN (IS=12f BF=220 VAF=90)',
        '.model DX D (IS=4n N=1.9)',
        '.end',
      ].join('\n'),
    );
    const settings = analysisSettingsSchema.parse({ inputSource: 'VS', outputNode: 'c' });
    return { circuit, settings, results: computeWorksheet({ circuit, settings }) };
  };

  it('when the web app names a number by its data-result-path, then the flattened results hold that very number', () => {
    const { results } = stage();
    if (results.status !== 'solved') throw new Error('the stage should solve');
    const flat = flattenResults(encodeResults(results));
    const { devices, smallSignal, sweep, signalSize, loadLines, comparison } = results;
    if (!devices.ok || !smallSignal.ok || !sweep.ok || !signalSize.ok || !comparison?.ok) {
      throw new Error('every part should compute');
    }
    const q1 = results.bias.devices.q1;
    const port = signalSize.value.ports[0]!;
    const line = loadLines.find((l) => l.device === 'q1')!.result;
    const ideal = comparison.value.laws.find((l) => l.law === 'ideal')!;
    expect(q1?.kind).toBe('Q');
    const expected: Record<string, unknown> = {
      'nodes.c': results.bias.nodes.c,
      'devices.q1.ic': q1?.kind === 'Q' ? q1.ic : null,
      'devices.q1.region': q1?.region,
      'elements.rc.current': results.bias.elements.rc?.current,
      'sources.vcc': results.bias.sources.vcc,
      supplyPower: results.bias.supplyPower,
      'smallSignal.devices.q1.beta': devices.value.q1?.kind === 'Q' ? devices.value.q1.betaAc : 0,
      'gain.vv': smallSignal.value.gain.mag,
      'zin.ohm': smallSignal.value.zin.mag,
      'sweep.midbandDb': sweep.value.midbandDb,
      'signalSize.errorPercent': signalSize.value.errorPercent,
      [`signalSize.ports.${port.device}.${port.port}.ratio`]: port.ratio,
      'loadLine.q1.q.v': line.ok ? line.value.q.v : null,
      'comparison.ideal.nodes.c': ideal.operatingPoint?.nodes.c,
      'comparison.ideal.nodes.c.diffPercent': ideal.nodeDifferencePercent.c,
    };
    for (const [path, value] of Object.entries(expected)) {
      expect(typeof value === 'number' || typeof value === 'string', path).toBe(true);
      expect(flat.get(path), path).toBe(value);
    }
  });

  it('when a path names an input, then it is read from the circuit or settings; results come first, and unknown paths have no value', () => {
    const s = stage();
    const values = revisionValues({ ...s, results: encodeResults(s.results) });
    expect(valueAtPath(values, 'elements.r2.value')).toBe(10_000);
    expect(valueAtPath(values, 'elements.q1.model')).toBe('QN');
    expect(valueAtPath(values, 'models.qn.BF')).toBe(220);
    expect(valueAtPath(values, 'settings.temperature')).toBe(27);
    expect(valueAtPath(values, 'elements.rc.current')).toBe(
      values.results.get('elements.rc.current'),
    );
    expect(valueAtPath(values, 'results.nodes.c')).toBe(values.results.get('nodes.c'));
    expect(valueAtPath(values, 'results.elements.r2.value')).toBeUndefined();
    expect(valueAtPath(values, 'devices.q9.ic')).toBeUndefined();
    expect(flattenInputs(s.circuit, s.settings).get('elements.q1.nodes')).toBe('c b e');
  });

  it.each([
    [1, 1 + 1e-13, 1e-12, true],
    [1, 1 + 1e-11, 1e-12, false],
    [0, 0, 1e-12, true],
    [0, 1e-300, 1e-12, false],
    ['Infinity', 'Infinity', 1e-12, true],
    [2.5, '2.5', 1e-12, false],
    [null, null, 0, true],
  ] as const)('when %j is compared with %j (tolerance %d), then equal is %s', (a, b, tol, same) => {
    expect(samePathValue(a, b, tol)).toBe(same);
  });
});
