import { describe, expect, it } from 'vitest';
import type { CircuitInput } from '../src/circuit.ts';
import { solveOperatingPoint, type OperatingPointOptions } from '../src/dc.ts';
import { EngineError, type EngineErrorCode, type EngineErrorDetails } from '../src/errors.ts';

/** Runs a solve that must fail and returns the error. */
function failure(circuit: CircuitInput, options?: OperatingPointOptions): EngineError {
  try {
    solveOperatingPoint(circuit, options);
  } catch (e) {
    if (e instanceof EngineError) return e;
    throw e;
  }
  throw new Error('the solve did not fail');
}

const V = (name: string, p: string, m: string, dc: number) => ({
  kind: 'V' as const,
  name,
  nodes: [p, m] as [string, string],
  dc,
});
const R = (name: string, p: string, m: string, value: number) => ({
  kind: 'R' as const,
  name,
  nodes: [p, m] as [string, string],
  value,
});
const dm = { name: 'dm', kind: 'D' as const, params: {} };

// One case per error the engine can raise for a circuit; each must name what it is about.
const cases: [
  string,
  CircuitInput,
  OperatingPointOptions | undefined,
  EngineErrorCode,
  EngineErrorDetails,
  RegExp,
][] = [
  [
    'zero resistance',
    { elements: [V('V1', 'a', '0', 1), R('R1', 'a', '0', 0)] },
    undefined,
    'invalid-circuit',
    { element: 'r1' },
    /r1 value/,
  ],
  [
    'negative resistance',
    { elements: [V('V1', 'a', '0', 1), R('R7', 'a', '0', -5)] },
    undefined,
    'invalid-circuit',
    { element: 'r7' },
    /r7/,
  ],
  [
    'duplicate element name',
    { elements: [V('V1', 'a', '0', 1), R('R1', 'a', '0', 1), R('r1', 'a', '0', 2)] },
    undefined,
    'invalid-circuit',
    { element: 'r1' },
    /used twice/,
  ],
  ['empty circuit', { elements: [] }, undefined, 'invalid-circuit', {}, /no elements/],
  [
    'model not defined',
    {
      elements: [
        V('V1', 'a', '0', 1),
        R('R1', 'a', 'k', 1e3),
        { kind: 'D', name: 'D1', nodes: ['k', '0'], model: 'nope' },
      ],
    },
    undefined,
    'unknown-model',
    { element: 'd1' },
    /model nope, which is not defined/,
  ],
  [
    'model of the wrong kind',
    {
      elements: [
        V('V1', 'a', '0', 1),
        R('R1', 'a', 'k', 1e3),
        { kind: 'D', name: 'D1', nodes: ['k', '0'], model: 'q' },
      ],
      models: [{ name: 'q', kind: 'NPN', params: {} }],
    },
    undefined,
    'unknown-model',
    { element: 'd1' },
    /needs a D model/,
  ],
  [
    'node named by one terminal only',
    { elements: [V('V1', 'a', '0', 1), R('R1', 'a', '0', 1e3), R('R2', 'a', 'tip', 1e3)] },
    undefined,
    'dangling-node',
    { node: 'tip', element: 'r2' },
    /only to r2/,
  ],
  [
    'one capacitor terminal is a dangling node too',
    {
      elements: [
        V('V1', 'a', '0', 1),
        R('R1', 'a', '0', 1e3),
        { kind: 'C', name: 'C1', nodes: ['a', 'x'], value: 1e-6 },
      ],
    },
    undefined,
    'dangling-node',
    { node: 'x', element: 'c1' },
    /node x/,
  ],
  [
    'node between two capacitors has no DC path',
    {
      elements: [
        V('V1', 'a', '0', 1),
        { kind: 'C', name: 'C1', nodes: ['a', 'm'], value: 1e-6 },
        { kind: 'C', name: 'C2', nodes: ['m', '0'], value: 1e-6 },
      ],
    },
    undefined,
    'floating-node',
    { node: 'm' },
    /no DC path to ground/,
  ],
  [
    'circuit not connected to ground',
    { elements: [V('V1', 'a', 'b', 1), R('R1', 'a', 'b', 1e3)] },
    undefined,
    'floating-node',
    { node: 'a' },
    /node a/,
  ],
  [
    'two voltage sources in parallel',
    { elements: [V('V1', 'a', '0', 1), V('V2', 'a', '0', 2), R('R1', 'a', '0', 1)] },
    undefined,
    'voltage-source-loop',
    { element: 'v2' },
    /v2 closes a loop/,
  ],
  [
    'inductor across a voltage source',
    { elements: [V('V1', 'a', '0', 1), { kind: 'L', name: 'L1', nodes: ['a', '0'], value: 1e-3 }] },
    undefined,
    'voltage-source-loop',
    { element: 'l1' },
    /l1 closes a loop/,
  ],
  [
    'no convergence within the iteration cap',
    {
      elements: [
        V('V1', 'in', '0', 5),
        R('R1', 'in', 'a', 1e3),
        { kind: 'D', name: 'D1', nodes: ['a', '0'], model: 'dm' },
      ],
      models: [dm],
    },
    { maxIterations: 1 },
    'no-convergence',
    { node: 'a' },
    /did not converge.*node a/,
  ],
  [
    'no consistent diode state (positive feedback around an ideal diode)',
    {
      // Off: V(a) = 1 V, V(c) = 2·1 − 2 = 0 V, so the diode is driven on. On: V(a) = V(c) = 2·V(a) − 2
      // gives V(a) = 2 V, and the diode would carry (1 − 2)/1k < 0, so it turns off again.
      elements: [
        V('V1', 's', '0', 1),
        R('R1', 's', 'a', 1e3),
        { kind: 'D', name: 'D1', nodes: ['a', 'c'], model: 'dm' },
        { kind: 'E', name: 'E1', nodes: ['c', 'm', 'a', '0'], gain: 2 },
        V('V2', 'm', '0', -2),
      ],
      models: [dm],
    },
    { diodeLaw: 'ideal' },
    'state-cycle',
    { element: 'd1' },
    /no consistent on\/off assignment/,
  ],
  [
    'fixed-drop diode directly across a source',
    {
      elements: [V('V1', 'a', '0', 5), { kind: 'D', name: 'D1', nodes: ['a', '0'], model: 'dm' }],
      models: [dm],
    },
    { diodeLaw: 'constant-drop' },
    'voltage-source-loop',
    { element: 'd1' },
    /fixed drop inside a loop/,
  ],
  [
    'MOSFET shorter than twice its lateral diffusion',
    {
      elements: [
        V('V1', 'd', '0', 5),
        R('R1', 'd', 'x', 1e3),
        { kind: 'M', name: 'M1', nodes: ['x', 'd', '0', '0'], model: 'nm', w: 1e-6, l: 1e-6 },
      ],
      models: [{ name: 'nm', kind: 'NMOS', params: { LD: 0.6e-6 } }],
    },
    undefined,
    'bad-value',
    { element: 'm1' },
    /effective channel length/,
  ],
  [
    'temperature below absolute zero',
    { elements: [V('V1', 'a', '0', 1), R('R1', 'a', '0', 1)] },
    { temperature: -300 },
    'bad-option',
    {},
    /option temperature/,
  ],
];

describe('every engine error names what it is about', () => {
  it.each(cases)('%s', (_title, circuit, options, code, details, message) => {
    const e = failure(circuit, options);
    expect(e.code).toBe(code);
    expect(e.details).toMatchObject(details);
    expect(e.message).toMatch(message);
  });
});
