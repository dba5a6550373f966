import { describe, expect, it } from 'vitest';
import type { CircuitInput } from '../src/circuit.ts';
import { solveOperatingPoint, type DiodeOp } from '../src/dc.ts';

const dmodel = [{ name: 'dm', kind: 'D' as const, params: {} }];
const diode = (op: ReturnType<typeof solveOperatingPoint>, name: string): DiodeOp =>
  op.devices[name] as DiodeOp;

/** VDD → R → diode to ground. */
const series = (vdd: number, r: number): CircuitInput => ({
  elements: [
    { kind: 'V', name: 'VDD', nodes: ['vdd', '0'], dc: vdd },
    { kind: 'R', name: 'R1', nodes: ['vdd', 'a'], value: r },
    { kind: 'D', name: 'D1', nodes: ['a', '0'], model: 'dm' },
  ],
  models: dmodel,
});

describe('constant-drop law, hand analysis (common practice: 0.7 V drop)', () => {
  it.each([
    [5, 1e3],
    [12, 4.7e3],
    [1.5, 100],
    [3.3, 220e3],
  ])('VDD=%s V, R=%s Ω: ID = (VDD − 0.7 V)/R exactly', (vdd, r) => {
    const op = solveOperatingPoint(series(vdd, r), { diodeLaw: 'constant-drop' });
    expect(diode(op, 'd1').id).toBe((vdd - 0.7) / r);
    expect(diode(op, 'd1').vd).toBe(0.7);
    expect(diode(op, 'd1').region).toBe('forward');
    expect(op.method).toBe('assumed-state');
  });
  it('takes the drop from the options', () => {
    const op = solveOperatingPoint(series(5, 1e3), {
      diodeLaw: 'constant-drop',
      constantDrop: { vOn: 0.65 },
    });
    expect(diode(op, 'd1').id).toBe((5 - 0.65) / 1e3);
  });
  it('keeps a reverse-biased diode off (hand analysis: no current, full supply across it)', () => {
    const op = solveOperatingPoint(series(-5, 1e3), { diodeLaw: 'constant-drop', gmin: 0 });
    expect(diode(op, 'd1').region).toBe('reverse');
    expect(Math.abs(diode(op, 'd1').id)).toBe(0);
    expect(op.nodes.a).toBe(-5);
  });
});

describe('ideal and piecewise-linear laws, hand analysis', () => {
  it('ideal: a forward diode is a short, ID = VDD/R', () => {
    const op = solveOperatingPoint(series(5, 1e3), { diodeLaw: 'ideal' });
    expect(diode(op, 'd1').id).toBe(5e-3);
    expect(op.nodes.a).toBe(0);
  });
  it('piecewise-linear (V0 = 0.6 V, rD = 20 Ω, common practice): ID = (VDD − V0)/(R + rD)', () => {
    const op = solveOperatingPoint(series(5, 1e3), { diodeLaw: 'piecewise-linear' });
    expect(diode(op, 'd1').id).toBeCloseTo((5 - 0.6) / 1020, 15);
    expect(diode(op, 'd1').rd).toBe(20);
  });
  it('ideal half-wave clamp: the diode to a 2 V reference holds the node at 2 V', () => {
    const op = solveOperatingPoint(
      {
        elements: [
          { kind: 'V', name: 'V1', nodes: ['in', '0'], dc: 10 },
          { kind: 'R', name: 'R1', nodes: ['in', 'a'], value: 1e3 },
          { kind: 'R', name: 'R2', nodes: ['a', '0'], value: 1e3 },
          { kind: 'D', name: 'D1', nodes: ['a', 'ref'], model: 'dm' },
          { kind: 'V', name: 'VREF', nodes: ['ref', '0'], dc: 2 },
        ],
        models: dmodel,
      },
      { diodeLaw: 'ideal' },
    );
    expect(op.nodes.a).toBe(2);
    // Hand analysis: 8 mA through R1, 2 mA through R2, 6 mA into the reference.
    expect(diode(op, 'd1').id).toBeCloseTo(6e-3, 15);
  });
});

describe('assumed-state iteration', () => {
  it('must flip a diode back off: both diodes look forward with everything off, only D1 conducts', () => {
    // All off: V(a) = 10 V, so both diodes are driven on. With both on, D2 would carry
    // (V(a) − 0.7 − 8)/1k < 0, so it is flipped back off. Hand analysis with D1 alone:
    // (10 − V(a))/1k = (V(a) − 0.7)/1k → V(a) = 5.35 V, D2 sees 5.35 − 8 < 0.7 V: off.
    const op = solveOperatingPoint(
      {
        elements: [
          { kind: 'V', name: 'V1', nodes: ['in', '0'], dc: 10 },
          { kind: 'R', name: 'R1', nodes: ['in', 'a'], value: 1e3 },
          { kind: 'D', name: 'D1', nodes: ['a', 'b'], model: 'dm' },
          { kind: 'R', name: 'R2', nodes: ['b', '0'], value: 1e3 },
          { kind: 'D', name: 'D2', nodes: ['a', 'c'], model: 'dm' },
          { kind: 'R', name: 'R3', nodes: ['c', 'ref'], value: 1e3 },
          { kind: 'V', name: 'V2', nodes: ['ref', '0'], dc: 8 },
        ],
        models: dmodel,
      },
      { diodeLaw: 'constant-drop', gmin: 0 },
    );
    expect(diode(op, 'd1').region).toBe('forward');
    expect(diode(op, 'd2').region).toBe('reverse');
    expect(op.nodes.a).toBeCloseTo(5.35, 12);
    expect(op.iterations).toBeGreaterThanOrEqual(3);
  });
  it('diode OR: the higher input wins and the other diode stays off (one-at-a-time revision)', () => {
    const op = solveOperatingPoint(
      {
        elements: [
          { kind: 'V', name: 'V1', nodes: ['x', '0'], dc: 5 },
          { kind: 'V', name: 'V2', nodes: ['y', '0'], dc: 3 },
          { kind: 'D', name: 'D1', nodes: ['x', 'out'], model: 'dm' },
          { kind: 'D', name: 'D2', nodes: ['y', 'out'], model: 'dm' },
          { kind: 'R', name: 'RL', nodes: ['out', '0'], value: 1e3 },
        ],
        models: dmodel,
      },
      { diodeLaw: 'constant-drop' },
    );
    expect(op.nodes.out).toBeCloseTo(4.3, 12);
    expect(diode(op, 'd2').region).toBe('reverse');
  });
  it('bipolar transistors keep their full model under a simplified diode law', () => {
    const op = solveOperatingPoint(
      {
        elements: [
          { kind: 'V', name: 'VCC', nodes: ['vcc', '0'], dc: 10 },
          { kind: 'R', name: 'RB', nodes: ['vcc', 'b'], value: 47e3 },
          { kind: 'Q', name: 'Q1', nodes: ['c', 'b', '0'], model: 'qn' },
          { kind: 'R', name: 'RC', nodes: ['vcc', 'c'], value: 1e3 },
          { kind: 'D', name: 'D1', nodes: ['c', '0'], model: 'dm' },
        ],
        models: [...dmodel, { name: 'qn', kind: 'NPN', params: { BF: 100 } }],
      },
      { diodeLaw: 'constant-drop' },
    );
    const q1 = op.devices.q1!;
    expect(q1.kind === 'Q' && q1.region).toBe('saturation');
    // The saturated collector sits below 0.7 V, so the constant-drop diode is off.
    expect(diode(op, 'd1').region).toBe('off');
  });
});
