import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { Circuit } from '../src/circuit.ts';
import {
  prepareOperatingPoint,
  solveOperatingPoint,
  solvePreparedOperatingPoint,
  withElementValue,
  type OperatingPoint,
  type OperatingPointOptions,
} from '../src/dc.ts';
import { parseDeck } from '../src/deck-parse.ts';
import { EngineError } from '../src/errors.ts';

// Reference: a cold solveOperatingPoint of the circuit with the value changed in its element
// list — the path that the ngspice comparisons check. A prepared circuit altered with
// withElementValue must give the same bias point (the brief: 1e-12 relative, every quantity).

const RELATIVE = 1e-12;
const deckDir = join(import.meta.dirname, 'decks');

function load(file: string): { circuit: Circuit; options: OperatingPointOptions } {
  const deck = parseDeck(readFileSync(join(deckDir, file), 'utf8'));
  const temperature = deck.directives.temperature;
  return { circuit: deck.circuit, options: temperature === undefined ? {} : { temperature } };
}

/** The circuit with one element's value field replaced, as a caller would build it anew. */
function altered(circuit: Circuit, name: string, value: number): Circuit {
  return {
    ...circuit,
    elements: circuit.elements.map((el) => {
      if (el.name.toLowerCase() !== name) return el;
      if (el.kind === 'V' || el.kind === 'I') return { ...el, dc: value };
      if (el.kind === 'E' || el.kind === 'G') return { ...el, gain: value };
      return { ...el, value } as typeof el;
    }),
  };
}

/** Every number of a result by its path (nodes.a, devices.q1.gm, …). */
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

/** Lists every quantity of `actual` that differs from `expected` by more than RELATIVE. */
function differences(actual: OperatingPoint, expected: OperatingPoint): string[] {
  const a = numbers(actual);
  const e = numbers(expected);
  const out: string[] = [];
  if ([...a.keys()].join() !== [...e.keys()].join()) out.push('the results hold different fields');
  for (const [path, ev] of e) {
    const av = a.get(path)!;
    const same = av === ev || Math.abs(av - ev) <= RELATIVE * Math.max(Math.abs(av), Math.abs(ev));
    if (!same) out.push(`${path}: ${av} (prepared) vs ${ev} (cold)`);
  }
  if (actual.method !== expected.method) out.push(`method ${actual.method} vs ${expected.method}`);
  return out;
}

const cases: { kind: string; file: string; element: string; value: number }[] = [
  { kind: 'diode', file: 'd-series.cir', element: 'r1', value: 3.3e3 },
  { kind: 'diode', file: 'd-bridge.cir', element: 'v1', value: 7.5 },
  { kind: 'diode', file: 'd-parallel.cir', element: 'r1', value: 560 },
  { kind: 'diode', file: 'd-temp75.cir', element: 'r2', value: 47e3 },
  { kind: 'BJT', file: 'q-npn-ce.cir', element: 'rc', value: 4.7e3 },
  { kind: 'BJT', file: 'q-pnp-stage.cir', element: 'r2', value: 56e3 },
  { kind: 'BJT', file: 'q-mirror.cir', element: 'rref', value: 10e3 },
  { kind: 'BJT', file: 'q-diffpair.cir', element: 'vip', value: -3e-3 },
  { kind: 'BJT', file: 'q-saturated.cir', element: 'rb', value: 10e3 },
  { kind: 'MOSFET', file: 'm-cs.cir', element: 'rd', value: 10e3 },
  { kind: 'MOSFET', file: 'm-diffpair-mirror.cir', element: 'itail', value: 150e-6 },
  { kind: 'MOSFET', file: 'm-inverter-triode.cir', element: 'vin', value: 1.1 },
  { kind: 'controlled source', file: 'ctrl-sources.cir', element: 'e1', value: -3 },
  { kind: 'controlled source', file: 'ctrl-sources.cir', element: 'g1', value: 1.5e-3 },
];

describe('prepared circuit, one element altered, solved from scratch', () => {
  it.each(cases)(
    '$kind: $file with $element = $value equals a cold solve of the altered circuit',
    ({ file, element, value }) => {
      const { circuit, options } = load(file);
      const prepared = prepareOperatingPoint(circuit, options);
      const op = solvePreparedOperatingPoint(
        withElementValue(prepared, element.toUpperCase(), value),
        options,
      );
      const cold = solveOperatingPoint(altered(circuit, element, value), options);
      expect(differences(op, cold)).toEqual([]);
      expect(op.iterations).toBe(cold.iterations);
    },
  );

  it('leaves the prepared circuit it started from as it was (diode, BJT and MOSFET decks)', () => {
    for (const file of ['d-series.cir', 'q-npn-ce.cir', 'm-cs.cir']) {
      const { circuit, options } = load(file);
      const prepared = prepareOperatingPoint(circuit, options);
      const resistor = circuit.elements.find((el) => el.kind === 'R')!;
      solvePreparedOperatingPoint(withElementValue(prepared, resistor.name, 1e3), options);
      const again = solvePreparedOperatingPoint(prepared, options);
      expect(differences(again, solveOperatingPoint(circuit, options))).toEqual([]);
    }
  });

  it('alternating between two altered variants gives each its own cold result', () => {
    const { circuit } = load('q-npn-ce.cir');
    const prepared = prepareOperatingPoint(circuit);
    const low = withElementValue(prepared, 'rc', 3.3e3);
    const high = withElementValue(prepared, 'rc', 4.7e3);
    const coldLow = solveOperatingPoint(altered(circuit, 'rc', 3.3e3));
    const coldHigh = solveOperatingPoint(altered(circuit, 'rc', 4.7e3));
    for (let i = 0; i < 3; i++) {
      expect(differences(solvePreparedOperatingPoint(low), coldLow)).toEqual([]);
      expect(differences(solvePreparedOperatingPoint(high), coldHigh)).toEqual([]);
    }
  });

  it('chains alters of several elements', () => {
    const { circuit } = load('q-pnp-stage.cir');
    const prepared = prepareOperatingPoint(circuit);
    const both = withElementValue(withElementValue(prepared, 'r1', 27e3), 'vcc', 9);
    const cold = solveOperatingPoint(altered(altered(circuit, 'r1', 27e3), 'vcc', 9));
    expect(differences(solvePreparedOperatingPoint(both), cold)).toEqual([]);
  });

  it('solves at a temperature other than the one it was prepared at', () => {
    const { circuit } = load('q-npn-ce.cir');
    const prepared = withElementValue(prepareOperatingPoint(circuit), 'rc', 4.7e3);
    const op = solvePreparedOperatingPoint(prepared, { temperature: 85 });
    const cold = solveOperatingPoint(altered(circuit, 'rc', 4.7e3), { temperature: 85 });
    expect(differences(op, cold)).toEqual([]);
  });

  it('uses a simplified diode law on the altered circuit like a cold solve', () => {
    const { circuit } = load('d-bridge.cir');
    const prepared = withElementValue(prepareOperatingPoint(circuit), 'rl', 2.2e3);
    const options: OperatingPointOptions = { diodeLaw: 'constant-drop' };
    const cold = solveOperatingPoint(altered(circuit, 'rl', 2.2e3), options);
    expect(differences(solvePreparedOperatingPoint(prepared, options), cold)).toEqual([]);
  });

  it('does not change the circuit object a cold solve was given', () => {
    const { circuit } = load('q-npn-ce.cir');
    const before = JSON.stringify(circuit);
    solveOperatingPoint(circuit);
    prepareOperatingPoint(circuit);
    expect(JSON.stringify(circuit)).toBe(before);
  });
});

describe('withElementValue errors', () => {
  const prepared = prepareOperatingPoint(load('q-npn-ce.cir').circuit);

  /** The EngineError thrown by `run`. */
  function thrown(run: () => unknown): EngineError {
    try {
      run();
    } catch (e) {
      if (e instanceof EngineError) return e;
      throw e;
    }
    throw new Error('no error was thrown');
  }

  it('names an element that is not in the circuit', () => {
    const e = thrown(() => withElementValue(prepared, 'R9', 1e3));
    expect(e.code).toBe('bad-option');
    expect(e.details.element).toBe('r9');
    expect(e.message).toBe('element r9 is not in the circuit');
  });

  it.each([0, -1e3, Number.NaN, Number.POSITIVE_INFINITY])(
    'names a resistor given the resistance %s',
    (value) => {
      const e = thrown(() => withElementValue(prepared, 'rc', value));
      expect(e.code).toBe('bad-value');
      expect(e.details.element).toBe('rc');
      expect(e.message).toBe(`rc: resistance must be a finite number > 0, not ${value}`);
    },
  );

  it('names a source given a value that is not finite', () => {
    const e = thrown(() => withElementValue(prepared, 'vcc', Number.NaN));
    expect(e.code).toBe('bad-value');
    expect(e.details.element).toBe('vcc');
  });

  it('names a device, which has no single value to change', () => {
    const e = thrown(() => withElementValue(prepared, 'q1', 2));
    expect(e.code).toBe('bad-value');
    expect(e.details.element).toBe('q1');
    expect(e.message).toMatch(/^q1 is a device/);
  });
});
