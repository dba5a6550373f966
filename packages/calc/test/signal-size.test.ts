import { describe, expect, it } from 'vitest';
import type { CircuitInput } from '../src/circuit.ts';
import { thermalVoltage } from '../src/constants.ts';
import { checkSignalSize } from '../src/signal-size.ts';

// A diode biased at 1 mA by a current source; the signal is a current riding on the bias.
// Exact quasi-static swing: ΔV = N·VT·ln(1 ± i/ID); linear: ±i·rd = ±N·VT·i/ID.
const diodeAt1mA: CircuitInput = {
  elements: [
    { kind: 'I', name: 'I1', nodes: ['0', 'a'], dc: 1e-3 },
    { kind: 'D', name: 'D1', nodes: ['a', '0'], model: 'dm' },
  ],
  models: [{ name: 'dm', kind: 'D', params: {} }],
};

describe('signal-size check of a diode at 1 mA (Shockley law, exact against linear)', () => {
  it.each([
    [1e-5, 0.01],
    [1e-4, 0.1],
    [5e-4, 0.5],
  ])('signal %s A: error equals the closed form, junction ratio i/ID', (amp, fraction) => {
    const r = checkSignalSize(diodeAt1mA, { input: 'i1', amplitude: amp, output: 'a' });
    // The worse side is the negative half: |ln(1 − x)|/x − 1.
    const expected = (Math.abs(Math.log(1 - fraction)) / fraction - 1) * 100;
    expect(Math.abs(r.errorPercent - expected)).toBeLessThan(1e-3);
    expect(Math.abs(r.ports[0]!.ratio - fraction)).toBeLessThan(1e-6);
    expect(Math.abs(r.ports[0]!.scale - thermalVoltage(27))).toBeLessThan(1e-9);
  });
  it('a small signal passes (error well under 10 %), a large one fails (over 10 %)', () => {
    const small = checkSignalSize(diodeAt1mA, { input: 'i1', amplitude: 2e-5, output: 'a' });
    expect(small.errorPercent).toBeLessThan(2);
    expect(small.pass).toBe(true);
    const large = checkSignalSize(diodeAt1mA, { input: 'i1', amplitude: 4e-4, output: 'a' });
    expect(large.errorPercent).toBeGreaterThan(10);
    expect(large.pass).toBe(false);
  });
  it('common practice: a swing well under VT (≤ 0.2·N·VT, about 5 mV) counts as small', () => {
    const r1 = checkSignalSize(diodeAt1mA, { input: 'i1', amplitude: 1.5e-4, output: 'a' });
    expect(r1.ports[0]!.swing).toBeLessThan(0.2 * thermalVoltage(27));
    expect(r1.ports[0]!.withinCommonPractice).toBe(true);
    const r2 = checkSignalSize(diodeAt1mA, { input: 'i1', amplitude: 3e-4, output: 'a' });
    expect(r2.ports[0]!.withinCommonPractice).toBe(false);
  });
  it('second harmonic of ln(1 + x·sin θ) is about x/4 for small x', () => {
    const r = checkSignalSize(diodeAt1mA, { input: 'i1', amplitude: 1e-5, output: 'a' });
    expect(Math.abs(r.secondHarmonicPercent - 0.25)).toBeLessThan(1e-3);
  });
});

describe('signal-size check at midband of a capacitively coupled stage', () => {
  it('holds the coupling capacitor at its bias voltage and reports the BE junction swing', () => {
    const r = checkSignalSize(
      {
        elements: [
          { kind: 'V', name: 'VCC', nodes: ['vcc', '0'], dc: 12 },
          { kind: 'V', name: 'VIN', nodes: ['in', '0'], dc: 0 },
          { kind: 'C', name: 'C1', nodes: ['in', 'b'], value: 10e-6 },
          { kind: 'R', name: 'R1', nodes: ['vcc', 'b'], value: 47e3 },
          { kind: 'R', name: 'R2', nodes: ['b', '0'], value: 10e3 },
          { kind: 'R', name: 'RC', nodes: ['vcc', 'c'], value: 4.7e3 },
          { kind: 'R', name: 'RE', nodes: ['e', '0'], value: 1e3 },
          { kind: 'Q', name: 'Q1', nodes: ['c', 'b', 'e'], model: 'qn' },
        ],
        models: [{ name: 'qn', kind: 'NPN', params: { BF: 150 } }],
      },
      { input: 'vin', amplitude: 0.1, output: 'c' },
    );
    // Emitter degeneration: gain about −RC/RE, small BE swing, nearly linear.
    expect(r.linearGain).toBeLessThan(-4);
    expect(r.linearGain).toBeGreaterThan(-4.7);
    expect(r.ports.map((p) => p.port)).toEqual(['BE']);
    expect(r.errorPercent).toBeLessThan(5);
  });
});

// Example values for tests: a divider-biased common-emitter stage with input, emitter-bypass and
// output capacitors and a decoupling capacitor straight across the supply.
const coupledStage = (bypassAcrossSupply: boolean): CircuitInput => ({
  elements: [
    { kind: 'V', name: 'VCC', nodes: ['vcc', '0'], dc: 12 },
    { kind: 'V', name: 'VS', nodes: ['src', '0'], dc: 0 },
    { kind: 'R', name: 'RSRC', nodes: ['src', 'in'], value: 600 },
    { kind: 'C', name: 'CIN', nodes: ['in', 'b'], value: 10e-6 },
    { kind: 'R', name: 'R1', nodes: ['vcc', 'b'], value: 47e3 },
    { kind: 'R', name: 'R2', nodes: ['b', '0'], value: 10e3 },
    { kind: 'R', name: 'RC', nodes: ['vcc', 'c'], value: 4.7e3 },
    { kind: 'Q', name: 'Q1', nodes: ['c', 'b', 'e'], model: 'qn' },
    { kind: 'R', name: 'RE1', nodes: ['e', 'e2'], value: 100 },
    { kind: 'R', name: 'RE2', nodes: ['e2', '0'], value: 1e3 },
    { kind: 'C', name: 'CE', nodes: ['e2', '0'], value: 100e-6 },
    { kind: 'C', name: 'COUT', nodes: ['c', 'out'], value: 10e-6 },
    { kind: 'R', name: 'RL', nodes: ['out', '0'], value: 22e3 },
    ...(bypassAcrossSupply
      ? [{ kind: 'C' as const, name: 'CDEC', nodes: ['vcc', '0'] as [string, string], value: 1e-6 }]
      : []),
  ],
  models: [{ name: 'qn', kind: 'NPN', params: { IS: 12e-15, BF: 220, BR: 4, VAF: 90, VAR: 20 } }],
});

describe('signal-size check of a capacitively coupled common-emitter stage', () => {
  it.each([false, true])(
    'converges with coupling and bypass capacitors held (decoupling across the supply: %s)',
    (decoupled) => {
      const r = checkSignalSize(coupledStage(decoupled), {
        input: 'VS',
        amplitude: 2e-3,
        output: 'out',
      });
      // Gain of an emitter-degenerated stage ≈ −(RC‖RL)/(re + RE1) scaled by the source divider;
      // with about 1.3 mA, re ≈ 20 Ω: roughly −(3.87k)/(120) ≈ −32 before the source loss.
      expect(r.linearGain).toBeLessThan(-20);
      expect(r.linearGain).toBeGreaterThan(-40);
      expect(r.errorPercent).toBeLessThan(r.errorLimit);
      expect(r.pass).toBe(true);
    },
  );

  it('a larger signal leaves the linear region and fails the 10 % limit', () => {
    const r = checkSignalSize(coupledStage(false), { input: 'VS', amplitude: 0.3, output: 'out' });
    expect(r.errorPercent).toBeGreaterThan(10);
    expect(r.pass).toBe(false);
  });
});
