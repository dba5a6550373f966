import { describe, expect, it } from 'vitest';
import type { CircuitInput } from '../src/circuit.ts';
import { loadLine } from '../src/load-line.ts';

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);

describe('load-line picture data', () => {
  it('diode with RS behind a resistor: Thevenin = (VDD, R + RS), Q on both curves, tangent slope 1/rd', () => {
    const r = loadLine(
      {
        elements: [
          { kind: 'V', name: 'V1', nodes: ['in', '0'], dc: 5 },
          { kind: 'R', name: 'R1', nodes: ['in', 'a'], value: 1e3 },
          { kind: 'D', name: 'D1', nodes: ['a', '0'], model: 'dm' },
        ],
        models: [{ name: 'dm', kind: 'D', params: { RS: 5 } }],
      },
      { device: 'd1' },
    );
    // Hand analysis: the junction sees 5 V behind R + RS.
    expect(rel(r.thevenin.voltage, 5)).toBeLessThan(1e-9);
    expect(rel(r.thevenin.resistance, 1005)).toBeLessThan(1e-9);
    // Q is on the load line and on the device curve.
    expect(rel(r.q.i, (r.thevenin.voltage - r.q.v) / r.thevenin.resistance)).toBeLessThan(1e-9);
    expect(r.curve).toHaveLength(101);
    const [a, b] = r.tangent;
    expect(rel((b.i - a.i) / (b.v - a.v), r.slope)).toBeLessThan(1e-9);
    expect(r.loadLine[1].i).toBeCloseTo(5 / 1005, 12);
    // The curve reaches above the load line's current intercept so the intersection is visible.
    expect(r.curve[r.curve.length - 1]!.i).toBeGreaterThan(r.loadLine[1].i);
  });

  it('BJT base-emitter junction: RTh = RB + (βac + 1)·RE, the classic input load line', () => {
    const circuit: CircuitInput = {
      elements: [
        { kind: 'V', name: 'VCC', nodes: ['vcc', '0'], dc: 10 },
        { kind: 'V', name: 'VBB', nodes: ['bb', '0'], dc: 2 },
        { kind: 'R', name: 'RB', nodes: ['bb', 'b'], value: 10e3 },
        { kind: 'R', name: 'RC', nodes: ['vcc', 'c'], value: 2e3 },
        { kind: 'R', name: 'RE', nodes: ['e', '0'], value: 500 },
        { kind: 'Q', name: 'Q1', nodes: ['c', 'b', 'e'], model: 'qn' },
      ],
      models: [{ name: 'qn', kind: 'NPN', params: { BF: 100 } }],
    };
    const r = loadLine(circuit, { device: 'q1', points: 11 });
    expect(r.junction).toBe('BE');
    // βac = gm·rπ = BF here (no Early effect, no high injection); rμ = 1/gmin adds ~1e-8.
    expect(rel(r.thevenin.resistance, 10e3 + 101 * 500)).toBeLessThan(1e-6);
    expect(rel(r.thevenin.voltage, 2)).toBeLessThan(1e-6);
  });
});
