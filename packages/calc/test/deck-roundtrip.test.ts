import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { CircuitInput, DeckDirectives, ModelKind } from '../src/index.ts';
import {
  circuitSchema,
  exportDeck,
  formatSpiceNumber,
  parseDeck,
  parseValue,
} from '../src/index.ts';
import { MODEL_DEFAULTS, defaultFamily } from '../src/models/defaults.ts';

// An exported deck must read back to the same circuit: the exporter writes SPICE scale factors
// only where the SPICE reading of them gives back the very same double.

const stage: CircuitInput = {
  title: 'NMOS common-source stage',
  elements: [
    { kind: 'V', name: 'VDD', nodes: ['vdd', '0'], dc: 5 },
    { kind: 'V', name: 'VIN', nodes: ['g', '0'], dc: 1.2, ac: { mag: 1, phase: 0 } },
    { kind: 'R', name: 'RD', nodes: ['vdd', 'd'], value: 4700 },
    { kind: 'C', name: 'CL', nodes: ['d', '0'], value: 2.2e-12 },
    { kind: 'M', name: 'M1', nodes: ['d', 'g', '0', '0'], model: 'NCH', w: 10e-6, l: 1e-6 },
    { kind: 'D', name: 'D1', nodes: ['d', 'gnd'], model: 'DCLAMP', area: 2 },
    { kind: 'I', name: 'IB', nodes: ['vdd', 'd'], dc: -1e-6 },
  ],
  models: [
    { name: 'NCH', kind: 'NMOS', params: { VTO: 0.7, KP: 110e-6, LAMBDA: 0.04 } },
    { name: 'DCLAMP', kind: 'D', params: { IS: 1e-14, N: 1.05 } },
  ],
};

describe('exportDeck', () => {
  it('writes a SPICE deck with scale factors, LEVEL=1 for MOS models and the directives', () => {
    const deck = exportDeck(stage, {
      op: true,
      temperature: 50,
      ac: { type: 'dec', points: 20, fstart: 10, fstop: 1e9 },
    });
    expect(deck).toBe(
      [
        'NMOS common-source stage',
        'VDD vdd 0 DC 5',
        'VIN g 0 DC 1.2 AC 1 0',
        'RD vdd d 4.7k',
        'CL d 0 2.2p',
        'M1 d g 0 0 NCH W=10u L=1u',
        'D1 d gnd DCLAMP 2',
        'IB vdd d DC -1u',
        '.model NCH NMOS (LEVEL=1 VTO=0.7 KP=110u LAMBDA=40m)',
        '.model DCLAMP D (IS=10f N=1.05)',
        '.temp 50',
        '.op',
        '.ac dec 20 10 1g',
        '.end',
        '',
      ].join('\n'),
    );
  });

  it('reads back to the same circuit and directives', () => {
    const directives: DeckDirectives = {
      op: true,
      temperature: -40,
      ac: { type: 'oct', points: 7, fstart: 0.5, fstop: 2e6 },
    };
    const back = parseDeck(exportDeck(stage, directives));
    expect(back.circuit).toEqual(circuitSchema.parse(stage));
    expect(back.directives).toEqual(directives);
    expect(back.warnings).toEqual([]);
  });

  it('prefixes the SPICE letter when an element name lacks it', () => {
    const deck = exportDeck({
      elements: [
        { kind: 'R', name: 'load', nodes: ['a', '0'], value: 1e3 },
        { kind: 'V', name: 'V1', nodes: ['a', '0'], dc: 1 },
      ],
    });
    expect(deck.split('\n')[1]).toBe('Rload a 0 1k');
  });

  it('names the element when the circuit is invalid', () => {
    expect(() =>
      exportDeck({ elements: [{ kind: 'R', name: 'R1', nodes: ['a', '0'], value: -5 }] }),
    ).toThrow(/R1 value/);
  });
});

describe('formatSpiceNumber', () => {
  it.each([
    [4700, '4.7k'],
    [1e-14, '10f'],
    [0.7, '0.7'],
    [1e6, '1meg'],
    [25.4e-6, '25.4u'],
    [0, '0'],
    [-3.3e-3, '-3.3m'],
    [1e-20, '0.00001f'],
    [0.1 + 0.2, '0.30000000000000004'],
  ])('%d → %s', (x, text) => {
    expect(formatSpiceNumber(x)).toBe(text);
  });

  it('always reads back to the same double (property over all finite doubles)', () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), (x) => {
        expect(parseValue(formatSpiceNumber(x))).toBe(x === 0 ? 0 : x);
      }),
      { numRuns: 2000 },
    );
  });
});

// Random circuits for the round-trip property. Values span the whole double range the schema
// accepts; names and nodes use every character the schema allows.
const value = fc.double({ min: 1e-30, max: 1e30, noNaN: true });
const signed = fc
  .double({ min: -1e30, max: 1e30, noNaN: true }) // SPICE text has no negative zero.
  .map((x) => x + 0);
const node = fc.oneof(fc.constantFrom('0', 'gnd'), fc.stringMatching(/^[a-z0-9_.:+-]{1,6}$/));
const nodes2 = fc.tuple(node, node);
const nodes4 = fc.tuple(node, node, node, node);
const modelNames: Record<ModelKind, string> = {
  D: 'Dm',
  NPN: 'qn_1',
  PNP: 'QP.2',
  NMOS: 'nch-a',
  PMOS: 'PCH',
};
const ac = fc.option(fc.record({ mag: signed, phase: signed }), { nil: undefined });

const elementOf = (i: number) =>
  fc
    .oneof(
      fc.record({
        kind: fc.constantFrom('R' as const, 'C' as const, 'L' as const),
        nodes: nodes2,
        value,
      }),
      fc.record({
        kind: fc.constantFrom('V' as const, 'I' as const),
        nodes: nodes2,
        dc: signed,
        ac,
      }),
      fc.record({
        kind: fc.constant('D' as const),
        nodes: nodes2,
        model: fc.constant(modelNames.D),
        area: value,
      }),
      fc.record({
        kind: fc.constant('Q' as const),
        nodes: fc.tuple(node, node, node),
        model: fc.constantFrom(modelNames.NPN, modelNames.PNP),
        area: value,
      }),
      fc.record({
        kind: fc.constant('M' as const),
        nodes: nodes4,
        model: fc.constantFrom(modelNames.NMOS, modelNames.PMOS),
        w: value,
        l: value,
      }),
      fc.record({ kind: fc.constantFrom('E' as const, 'G' as const), nodes: nodes4, gain: signed }),
    )
    .map((e) => {
      const withoutAc = 'ac' in e && e.ac === undefined ? (({ ac: _ac, ...rest }) => rest)(e) : e;
      return { ...withoutAc, name: `${i % 2 ? e.kind : e.kind.toLowerCase()}${i}` };
    });

const modelOf = (kind: ModelKind) =>
  fc.subarray(Object.keys(MODEL_DEFAULTS[defaultFamily(kind)])).chain((names) =>
    fc.tuple(...names.map(() => signed)).map((values) => ({
      name: modelNames[kind],
      kind,
      params: Object.fromEntries(names.map((n, j) => [n, values[j] ?? 0])),
    })),
  );

const circuit = fc.record({
  title: fc.stringMatching(/^[ -~]{0,60}$/).map((t) => t.replace(/\s+/g, ' ').trim()),
  elements: fc
    .integer({ min: 1, max: 12 })
    .chain((count) => fc.tuple(...Array.from({ length: count }, (_, i) => elementOf(i + 1)))),
  models: fc.tuple(modelOf('D'), modelOf('NPN'), modelOf('PNP'), modelOf('NMOS'), modelOf('PMOS')),
});

const directives = fc.record({
  op: fc.boolean(),
  temperature: fc.option(
    fc.double({ min: -273, max: 1000, noNaN: true }).map((t) => t + 0),
    { nil: undefined },
  ),
  ac: fc.option(
    fc
      .record({
        type: fc.constantFrom('dec' as const, 'oct' as const, 'lin' as const),
        points: fc.integer({ min: 1, max: 10_000 }),
        fstart: value,
        ratio: fc.double({ min: 1, max: 1e6, noNaN: true }),
      })
      .map(({ ratio, ...s }) => ({ ...s, fstop: Math.max(s.fstart, s.fstart * ratio) })),
    { nil: undefined },
  ),
});

describe('deck round trip (property)', () => {
  it('parseDeck(exportDeck(c, d)) gives back c and d for random circuits', () => {
    fc.assert(
      fc.property(circuit, directives, (c, d) => {
        const wanted = { ...d };
        if (wanted.temperature === undefined) delete wanted.temperature;
        if (wanted.ac === undefined) delete wanted.ac;
        const back = parseDeck(exportDeck(c, wanted));
        expect(back.circuit).toEqual(circuitSchema.parse(c));
        expect(back.directives).toEqual(wanted);
        expect(back.warnings).toEqual([]);
      }),
      { numRuns: 300 },
    );
  });
});
