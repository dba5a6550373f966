import { describe, expect, it } from 'vitest';
import { runAcSweep, sweepFrequencies } from '../src/ac.ts';
import type { CircuitInput } from '../src/circuit.ts';

const R = 1e3;
const C = 1e-6;
const fc = 1 / (2 * Math.PI * R * C);

/** First-order RC section driven by a 1 V AC source; `highPass` swaps R and C. */
const rc = (highPass: boolean): CircuitInput => ({
  elements: [
    { kind: 'V', name: 'VIN', nodes: ['in', '0'], dc: 0, ac: { mag: 1, phase: 0 } },
    highPass
      ? { kind: 'C', name: 'C1', nodes: ['in', 'out'], value: C }
      : { kind: 'R', name: 'R1', nodes: ['in', 'out'], value: R },
    highPass
      ? { kind: 'R', name: 'R1', nodes: ['out', '0'], value: R }
      : { kind: 'C', name: 'C1', nodes: ['out', '0'], value: C },
  ],
});

describe('AC sweep of a single-pole RC low-pass against |H| = 1/√(1+(f/fc)²), ∠H = −atan(f/fc)', () => {
  const result = runAcSweep(rc(false), {
    sweep: { type: 'dec', points: 20, fstart: fc / 1e4, fstop: fc * 100 },
    probe: 'out',
  });
  it('matches the formula at every sweep point', () => {
    result.freq.forEach((f, i) => {
      const x = f / fc;
      expect(Math.abs(result.db[i]! - 20 * Math.log10(1 / Math.sqrt(1 + x * x)))).toBeLessThan(
        1e-9,
      );
      expect(Math.abs(result.deg[i]! + (Math.atan(x) * 180) / Math.PI)).toBeLessThan(1e-9);
    });
  });
  it('finds the −3 dB corner at fc = 1/(2πRC) to 1e-6 relative, midband 0 dB, no low corner', () => {
    expect(Math.abs(result.highCornerHz! - fc) / fc).toBeLessThan(1e-6);
    expect(Math.abs(result.midbandDb)).toBeLessThan(1e-9);
    expect(result.lowCornerHz).toBeNull();
  });
});

describe('AC sweep of an RC high-pass', () => {
  it('finds the low corner at fc and the phase lead atan(fc/f)', () => {
    const r = runAcSweep(rc(true), {
      sweep: { type: 'oct', points: 4, fstart: fc / 100, fstop: fc * 1e4 },
      probe: 'out',
    });
    expect(Math.abs(r.lowCornerHz! - fc) / fc).toBeLessThan(1e-6);
    expect(r.highCornerHz).toBeNull();
    r.freq.forEach((f, i) =>
      expect(Math.abs(r.deg[i]! - (Math.atan(fc / f) * 180) / Math.PI)).toBeLessThan(1e-9),
    );
  });
});

describe('sweep points as SPICE generates them', () => {
  it('dec: fstart·10^(k/N) up to fstop (ngspice 39 `.ac dec 5 1 100meg` prints 41 points)', () => {
    const f = sweepFrequencies({ type: 'dec', points: 5, fstart: 1, fstop: 100e6 });
    expect(f).toHaveLength(41);
    f.forEach((v, k) => expect(Math.abs(v - 10 ** (k / 5)) / v).toBeLessThan(1e-12));
  });
  it('oct: fstart·2^(k/N)', () => {
    const f = sweepFrequencies({ type: 'oct', points: 2, fstart: 100, fstop: 1600 });
    expect(f).toHaveLength(9);
    expect(Math.abs(f[8]! - 1600) / 1600).toBeLessThan(1e-12);
  });
  it('lin: N evenly spaced points including both ends', () => {
    expect(sweepFrequencies({ type: 'lin', points: 5, fstart: 10, fstop: 50 })).toEqual([
      10, 20, 30, 40, 50,
    ]);
  });
});
