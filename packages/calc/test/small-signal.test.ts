import { describe, expect, it } from 'vitest';
import type { CircuitInput } from '../src/circuit.ts';
import { thermalVoltage } from '../src/constants.ts';
import { solveOperatingPoint, type BjtOp, type DiodeOp } from '../src/dc.ts';
import { smallSignalAt } from '../src/small-signal.ts';

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);

describe('device parameters at Q from their formulas', () => {
  it.each([
    [1e-14, 1, 0, 1e3],
    [2.5e-9, 1.75, 0.5, 4.7e3],
    [1e-12, 1.3, 3, 220],
  ])('diode IS=%s N=%s RS=%s: rd = N·VT/ID (Shockley), rs = RS', (is, n, rs, r) => {
    const op = solveOperatingPoint(
      {
        elements: [
          { kind: 'V', name: 'V1', nodes: ['in', '0'], dc: 5 },
          { kind: 'R', name: 'R1', nodes: ['in', 'a'], value: r },
          { kind: 'D', name: 'D1', nodes: ['a', '0'], model: 'dx' },
        ],
        models: [{ name: 'dx', kind: 'D', params: { IS: is, N: n, RS: rs } }],
      },
      { gmin: 0 },
    );
    const d = op.devices.d1 as DiodeOp;
    // Shockley: dID/dVj = (ID + IS)/(N·VT).
    expect(rel(d.rd, (n * thermalVoltage(27)) / (d.id + is))).toBeLessThan(1e-12);
    // Common form N·VT/ID: exact but for the IS term, i.e. to IS/ID relative.
    expect(rel(d.rd, (n * thermalVoltage(27)) / d.id)).toBeLessThan(1e-9 + (2 * is) / d.id);
    expect(d.rs).toBe(rs);
    expect(Math.abs(d.vd - d.vj - d.id * rs)).toBeLessThan(1e-12);
  });

  it('BJT in forward-active region with VAF = ∞: gm = IC/VT, rπ = β/gm, ro = ∞ (hybrid-π)', () => {
    // gmin = 0: SPICE's gmin across the reverse-biased BC junction adds gmin·VBC to IC.
    const op = solveOperatingPoint(
      {
        elements: [
          { kind: 'V', name: 'VCC', nodes: ['vcc', '0'], dc: 10 },
          { kind: 'V', name: 'VB', nodes: ['b', '0'], dc: 0.68 },
          { kind: 'R', name: 'RC', nodes: ['vcc', 'c'], value: 2e3 },
          { kind: 'Q', name: 'Q1', nodes: ['c', 'b', '0'], model: 'qn' },
        ],
        models: [{ name: 'qn', kind: 'NPN', params: { IS: 1e-15, BF: 120 } }],
      },
      { gmin: 0 },
    );
    const q = op.devices.q1 as BjtOp;
    expect(q.region).toBe('active');
    expect(rel(q.gm, q.ic / thermalVoltage(27))).toBeLessThan(1e-9);
    expect(rel(q.rpi, 120 / q.gm)).toBeLessThan(1e-9);
    expect(rel(q.betaAc, 120)).toBeLessThan(1e-9);
    // Without Early effect only the reverse-biased BC junction's transport term is left in go.
    expect(q.ro).toBeGreaterThan(1e15);
  });
});

describe('small-signal conductances against ngspice-39 (values printed by ngspice, hard-coded)', () => {
  // Deck (run with `ngspice -b`, `.options reltol=1e-7 abstol=1e-16 vntol=1e-10`, `op`, then
  // `print @q1[gm] @q1[gpi] @q1[go] @q1[ic]` with `set numdgt=12`):
  //   VCC vcc 0 12 / R1 vcc b 47k / R2 b 0 10k / RC vcc c 4.7k / RE e 0 1k / Q1 c b e qn
  //   .model qn NPN(IS=1e-15 BF=150 BR=2 VAF=80 VAR=20 NF=1.01 NR=1.02 ISE=1e-14 NE=1.6
  //                 IKF=0.05 ISC=1e-13 NC=1.9 IKR=0.02 RB=100 RC=5 RE=0.5)  .temp 50
  // ngspice uses CODATA 2014 constants, hence 1e-5 rather than machine precision.
  it('Gummel-Poon stage with Early, high injection, leakage and series resistances at 50 °C', () => {
    const circuit: CircuitInput = {
      elements: [
        { kind: 'V', name: 'VCC', nodes: ['vcc', '0'], dc: 12 },
        { kind: 'R', name: 'R1', nodes: ['vcc', 'b'], value: 47e3 },
        { kind: 'R', name: 'R2', nodes: ['b', '0'], value: 10e3 },
        { kind: 'R', name: 'RC', nodes: ['vcc', 'c'], value: 4.7e3 },
        { kind: 'R', name: 'RE', nodes: ['e', '0'], value: 1e3 },
        { kind: 'Q', name: 'Q1', nodes: ['c', 'b', 'e'], model: 'qn' },
      ],
      models: [
        {
          name: 'qn',
          kind: 'NPN',
          params: {
            IS: 1e-15,
            BF: 150,
            BR: 2,
            VAF: 80,
            VAR: 20,
            NF: 1.01,
            NR: 1.02,
            ISE: 1e-14,
            NE: 1.6,
            IKF: 0.05,
            ISC: 1e-13,
            NC: 1.9,
            IKR: 0.02,
            RB: 100,
            RC: 5,
            RE: 0.5,
          },
        },
      ],
    };
    const q = solveOperatingPoint(circuit, { temperature: 50 }).devices.q1 as BjtOp;
    expect(rel(q.ic, 0.001323582685491)).toBeLessThan(1e-5);
    expect(rel(q.gm, 0.04580874882623)).toBeLessThan(1e-5);
    expect(rel(1 / q.rpi, 0.000328022594111)).toBeLessThan(1e-5);
    expect(rel(1 / q.ro, 0.00001634606121996)).toBeLessThan(1e-5);
  });
});

describe('gain, input and output impedance (smallSignalAt)', () => {
  it('RC low-pass at f: H = 1/(1+jωRC), Zin = R + 1/(jωC), Zout = R ∥ 1/(jωC)', () => {
    const R = 1e3,
      C = 1e-7,
      f = 2e3;
    const r = smallSignalAt(
      {
        elements: [
          { kind: 'V', name: 'VIN', nodes: ['in', '0'], dc: 1 },
          { kind: 'R', name: 'R1', nodes: ['in', 'out'], value: R },
          { kind: 'C', name: 'C1', nodes: ['out', '0'], value: C },
        ],
      },
      { input: 'vin', output: 'out', frequency: f },
    );
    const wrc = 2 * Math.PI * f * R * C;
    expect(rel(r.gain.mag, 1 / Math.hypot(1, wrc))).toBeLessThan(1e-12);
    expect(Math.abs(r.gain.deg + (Math.atan(wrc) * 180) / Math.PI)).toBeLessThan(1e-10);
    const xc = 1 / (2 * Math.PI * f * C);
    expect(rel(r.zin.re, R)).toBeLessThan(1e-12);
    expect(rel(r.zin.im, -xc)).toBeLessThan(1e-12);
    expect(rel(r.zout.mag, (R * xc) / Math.hypot(R, xc))).toBeLessThan(1e-12);
  });

  it('common-emitter stage driven at the base: gain = −gm·(RC ∥ ro), Zin = rπ, Zout = RC ∥ ro (hybrid-π)', () => {
    const r = smallSignalAt(
      {
        elements: [
          { kind: 'V', name: 'VCC', nodes: ['vcc', '0'], dc: 10 },
          { kind: 'V', name: 'VB', nodes: ['b', '0'], dc: 0.66 },
          { kind: 'R', name: 'RC', nodes: ['vcc', 'c'], value: 3.3e3 },
          { kind: 'Q', name: 'Q1', nodes: ['c', 'b', '0'], model: 'qn' },
        ],
        models: [{ name: 'qn', kind: 'NPN', params: { IS: 1e-15, BF: 150, VAF: 60 } }],
      },
      { input: 'vb', output: 'c' },
    );
    const q = r.devices.q1!;
    if (q.kind !== 'Q') throw new Error('expected a BJT');
    const load = (3.3e3 * q.ro) / (3.3e3 + q.ro);
    // rμ = 1/gmin = 1 TΩ is in the model too; it shifts these by about 1e-8.
    expect(rel(r.gain.re, -q.gm * load)).toBeLessThan(1e-6);
    expect(rel(r.zin.mag, q.rpi)).toBeLessThan(1e-6);
    expect(rel(r.zout.mag, load)).toBeLessThan(1e-6);
    expect(r.linearized.map((e) => e.name)).toEqual(
      expect.arrayContaining(['q1.rpi', 'q1.gm', 'q1.ro']),
    );
  });
});
