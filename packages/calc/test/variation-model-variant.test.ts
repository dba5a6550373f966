import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { Circuit } from '../src/circuit.ts';
import {
  prepareOperatingPoint,
  solveOperatingPoint,
  solvePreparedOperatingPoint,
  type OperatingPoint,
} from '../src/dc.ts';
import { parseDeck } from '../src/deck-parse.ts';
import { EngineError } from '../src/errors.ts';
import { createEvaluator } from '../src/variation/evaluator.ts';
import { withModelParameters } from '../src/variation/model-variant.ts';
import { portableLog } from '../src/variation/random.ts';

// Reference: a cold solveOperatingPoint of the circuit with the model card edited in its model
// list — the path the ngspice comparisons check. A prepared circuit changed with
// withModelParameters must give the same bias point, every quantity within 1e-12 relative (the
// bar test/prepared.test.ts sets for withElementValue).

const RELATIVE = 1e-12;
const deckDir = join(import.meta.dirname, 'decks');

function load(file: string): { circuit: Circuit; temperature?: number } {
  const deck = parseDeck(readFileSync(join(deckDir, file), 'utf8'));
  const t = deck.directives.temperature;
  return { circuit: deck.circuit, ...(t === undefined ? {} : { temperature: t }) };
}

function withCard(circuit: Circuit, model: string, params: Record<string, number>): Circuit {
  return {
    ...circuit,
    models: circuit.models.map((m) =>
      m.name.toLowerCase() === model ? { ...m, params: { ...m.params, ...params } } : m,
    ),
  };
}

function numbers(op: OperatingPoint): Map<string, number> {
  const out = new Map<string, number>();
  const walk = (value: unknown, path: string): void => {
    if (typeof value === 'number') out.set(path, value);
    else if (value && typeof value === 'object')
      for (const [k, v] of Object.entries(value)) walk(v, path ? `${path}.${k}` : k);
  };
  walk(op, '');
  return out;
}

function differences(actual: OperatingPoint, expected: OperatingPoint): string[] {
  const a = numbers(actual);
  const out: string[] = [];
  for (const [path, ev] of numbers(expected)) {
    const av = a.get(path);
    if (av === undefined) out.push(`${path}: missing`);
    else if (!(av === ev || Math.abs(av - ev) <= RELATIVE * Math.max(Math.abs(av), Math.abs(ev))))
      out.push(`${path}: ${av} (variant) vs ${ev} (cold)`);
  }
  return out;
}

const cases: { file: string; model: string; params: Record<string, number>; why: string }[] = [
  { file: 'd-series.cir', model: 'dsig', params: { IS: 6e-9, N: 1.7 }, why: 'diode IS and N' },
  { file: 'd-parallel.cir', model: 'dpar', params: { RS: 1.6 }, why: 'diode RS (series stamp)' },
  { file: 'd-temp75.cir', model: 'dt', params: { XTI: 3, EG: 1.11 }, why: 'diode at 75 °C' },
  { file: 'q-npn-ce.cir', model: 'qn2', params: { BF: 126 }, why: 'BJT BF' },
  {
    file: 'q-npn-ce.cir',
    model: 'qn2',
    params: { RE: 2, RC: 5 },
    why: 'BJT gains RC, RE (new nodes)',
  },
  { file: 'q-pnp-stage.cir', model: 'qp1', params: { IS: 7e-15, VAF: 45 }, why: 'PNP IS and VAF' },
  { file: 'q-mirror.cir', model: 'qm', params: { BF: 90 }, why: 'two devices of one model' },
  { file: 'q-saturated.cir', model: 'qs', params: { IKF: 0.02, BR: 4 }, why: 'saturated BJT' },
  { file: 'm-cs.cir', model: 'nm1', params: { VTO: 0.9, KP: 1e-4 }, why: 'NMOS VTO and KP' },
  { file: 'm-diffpair-mirror.cir', model: 'pmd', params: { LAMBDA: 0.1 }, why: 'PMOS mirror' },
];

describe('withModelParameters against a cold solve of the edited card', () => {
  it.each(cases)('$file, $why: every quantity within 1e-12 relative', ({ file, model, params }) => {
    const { circuit, temperature } = load(file);
    const options = temperature === undefined ? {} : { temperature };
    const prepared = prepareOperatingPoint(circuit, options);
    const variant = withModelParameters(prepared, model, params);
    const expected = solveOperatingPoint(withCard(circuit, model, params), options);
    expect(differences(solvePreparedOperatingPoint(variant, options), expected)).toEqual([]);
  });

  it('when a variant is made, then the prepared circuit it came from still solves as before', () => {
    const { circuit } = load('q-npn-ce.cir');
    const prepared = prepareOperatingPoint(circuit);
    const before = solvePreparedOperatingPoint(prepared);
    solvePreparedOperatingPoint(withModelParameters(prepared, 'qn2', { BF: 60 }));
    expect(differences(solvePreparedOperatingPoint(prepared), before)).toEqual([]);
    expect(prepared.models.get('qn2')?.params.BF).toBe(180);
  });

  it('when the model is not in the circuit, then bad-option names it', () => {
    const prepared = prepareOperatingPoint(load('q-npn-ce.cir').circuit);
    expect(() => withModelParameters(prepared, 'qx', { BF: 1 })).toThrow(
      new EngineError('bad-option', 'model qx is not in the circuit'),
    );
  });

  it('when the parameter is not one the engine evaluates, then bad-option lists those it does', () => {
    const prepared = prepareOperatingPoint(load('q-npn-ce.cir').circuit);
    expect(() => withModelParameters(prepared, 'qn2', { HFE: 100 })).toThrow(
      /^model qn2 has no parameter HFE that the engine evaluates \(NPN: IS, BF, BR/,
    );
  });

  it('when the value is not finite, then bad-value says so', () => {
    const prepared = prepareOperatingPoint(load('q-npn-ce.cir').circuit);
    expect(() => withModelParameters(prepared, 'qn2', { BF: Number.NaN })).toThrow(
      'model qn2: BF must be a finite number, not NaN',
    );
  });
});

describe('portableLog (the logarithm of the normal draws)', () => {
  // Reference: Math.log, correctly rounded or within an ulp in V8 (fdlibm); the portable one
  // must agree within 2 ulp over the range the polar method feeds it, (0, 1).
  const inputs = [
    1e-300,
    5e-324,
    1e-20,
    2 ** -32,
    0.001,
    0.1,
    0.5,
    Math.SQRT1_2,
    0.7071,
    0.9,
    0.999999,
    1,
    2,
    10,
    1e300,
  ];
  it.each(inputs)('ln(%s) within 2 ulp of Math.log', (x) => {
    const expected = Math.log(x);
    const ulp = Math.max(Math.abs(expected) * Number.EPSILON, Number.MIN_VALUE);
    expect(Math.abs(portableLog(x) - expected)).toBeLessThanOrEqual(2 * ulp);
  });
});

describe('the evaluator’s reused device stamps (model-slots.ts) against cold solves', () => {
  // Several variants one after another through one evaluator, each checked against a cold solve
  // of its edited card: a stamp that kept a value from an earlier variant would show here.
  it.each(cases)(
    '$file, $why: three variants in a row, every node within 1e-12 relative',
    ({ file, model, params }) => {
      const { circuit, temperature } = load(file);
      const options = temperature === undefined ? {} : { temperature };
      const names = Object.keys(params);
      const cold = solveOperatingPoint(circuit, options);
      const probes = Object.keys(cold.nodes).map((n) => `nodes.${n}`);
      const ev = createEvaluator({
        circuit,
        settings: options,
        parameters: names.map((p) => ({ target: `${model}.${p}` })),
        probes,
      });
      const edited = names.map((p) => params[p]!);
      for (const values of [edited, Array.from(ev.nominal), edited.map((v) => v * 1.1)]) {
        const card = Object.fromEntries(names.map((p, i) => [p, values[i]!]));
        const expected = solveOperatingPoint(withCard(circuit, model, card), options);
        const got = ev.evaluate(values);
        const off = probes.filter((path, i) => {
          const e = expected.nodes[path.slice(6)]!;
          return !(Math.abs(got[i]! - e) <= RELATIVE * Math.abs(e) || got[i] === e);
        });
        expect(off).toEqual([]);
      }
    },
  );
});

describe('base resistance variants (RBM follows RB unless the card sets it)', () => {
  const deck = (card: string) =>
    parseDeck(
      `rb\nVCC vcc 0 12\nVB bb 0 0.9\nRBX bb b 1k\nRC vcc c 4.7k\nQ1 c b 0 QB\n.model QB NPN (${card})\n.end\n`,
    ).circuit;
  it.each([
    ['RB alone (constant base resistance)', 'IS=1e-15 BF=100 RB=100'],
    ['RB above RBM (bias-dependent base resistance)', 'IS=1e-15 BF=100 RB=100 RBM=20 IKF=5m'],
  ])('%s: each variant equals a cold solve of the edited card', (_what, card) => {
    const circuit = deck(card);
    const ev = createEvaluator({
      circuit,
      parameters: [{ target: 'qb.rb' }],
      probes: ['nodes.b', 'nodes.c'],
    });
    for (const rb of [200, 50, 150]) {
      const expected = solveOperatingPoint(withCard(circuit, 'qb', { RB: rb }));
      const [vb, vc] = ev.evaluate([rb]);
      expect(vb! / expected.nodes.b!).toBeCloseTo(1, 12);
      expect(vc! / expected.nodes.c!).toBeCloseTo(1, 12);
    }
  });
});
