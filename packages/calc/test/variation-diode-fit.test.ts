import { describe, expect, it } from 'vitest';
import { thermalVoltage } from '../src/constants.ts';
import { EngineError } from '../src/errors.ts';
import { diodeCurrent, fitDiode, wrightOmega } from '../src/variation/diode-fit.ts';
import { randomStream } from '../src/variation/random.ts';

// Synthetic measurements: a diode with IS = 2.5 fA, N = 1.3, RS = 1.5 Ω at 27 °C, 81 currents
// log-spaced from 100 pA to 100 mA (nine decades; RS dominates the top, IS and N the bottom), the
// voltage from the exact implicit law V = N·VT·ln(I/IS + 1) + I·RS, and the current then given
// 1 % Gaussian noise (σ = 1 %, seeded). Over 100 seeds this design spreads the fitted values by
// 0.52 % (IS), 0.03 % (N) and 0.56 % (RS) rms, so 2 % is more than 3.5 standard deviations.
const IS = 2.5e-15;
const N = 1.3;
const RS = 1.5;
const vt = thermalVoltage(27);

function measurements(seed: string, count = 81) {
  const noise = randomStream(seed, 'noise');
  return Array.from({ length: count }, (_, k) => {
    const i = 1e-10 * 10 ** ((9 * k) / (count - 1));
    return { v: N * vt * Math.log1p(i / IS) + i * RS, i: i * (1 + 0.01 * noise.normal()) };
  });
}

describe('diode fit recovers IS, N and RS from noisy synthetic data', () => {
  it.each(['fit-1', 'fit-2', 'fit-3'])(
    'seed %s: each within 2 %, RMS log error near the 1 % noise',
    (seed) => {
      const f = fitDiode({ points: measurements(seed) });
      expect(Math.abs(f.is / IS - 1)).toBeLessThan(0.02);
      expect(Math.abs(f.n / N - 1)).toBeLessThan(0.02);
      expect(Math.abs(f.rs / RS - 1)).toBeLessThan(0.02);
      // The residual of a 3-parameter fit to 81 points of 1 % noise: 1 %·√(78/81), within ±20 %.
      expect(f.rmsLogError).toBeGreaterThan(0.008);
      expect(f.rmsLogError).toBeLessThan(0.012);
      expect(f.residuals).toHaveLength(81);
    },
  );

  it('without noise the fit is exact to 1e-6', () => {
    const exact = measurements('x').map((p, k) => ({ v: p.v, i: 1e-10 * 10 ** ((9 * k) / 80) }));
    const f = fitDiode({ points: exact });
    expect([f.is / IS, f.n / N, f.rs / RS]).toEqual([
      expect.closeTo(1, 6),
      expect.closeTo(1, 6),
      expect.closeTo(1, 6),
    ]);
  });

  it('the closed form through Wright omega inverts the implicit law (Banwell and Jayakumar 2000)', () => {
    for (const i of [1e-9, 1e-3, 0.2]) {
      const v = N * vt * Math.log1p(i / IS) + i * RS;
      expect(diodeCurrent(v, IS, N, RS, vt) / i).toBeCloseTo(1, 12);
    }
    // ω(z) solves w + ln w = z; ω(1) = 1 exactly.
    expect(wrightOmega(1)).toBeCloseTo(1, 15);
    expect(wrightOmega(50) + Math.log(wrightOmega(50))).toBeCloseTo(50, 12);
  });
});

describe('diode fit rejects unusable data, each with its own message', () => {
  const good = measurements('fit-1', 6);
  it('fewer than 5 points', () => {
    expect(() => fitDiode({ points: good.slice(0, 4) })).toThrow(
      new EngineError('bad-value', 'a diode fit needs at least 5 measured points; got 4'),
    );
  });
  it('a current that is not positive', () => {
    const points = good.map((p, k) => (k === 2 ? { ...p, i: 0 } : p));
    expect(() => fitDiode({ points })).toThrow(
      `point 3 (${good[2]!.v} V, 0 A) has a current that is not positive: the fit works on log current and needs forward currents > 0 A`,
    );
  });
  it('current that does not rise with voltage', () => {
    const points = good.map((p, k) => (k === 4 ? { ...p, i: good[3]!.i / 2 } : p));
    expect(() => fitDiode({ points })).toThrow(
      `the data are not monotonic: the current must rise with the voltage, but at ${good[4]!.v} V it is ${good[3]!.i / 2} A against ${good[3]!.i} A at ${good[3]!.v} V`,
    );
  });
});
