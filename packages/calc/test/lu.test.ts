import { describe, expect, it } from 'vitest';
import { luFactor, luFactorSolve, luSolve } from '../src/lu.ts';

// Reference: the two-phase luFactor + luSolve (partial pivoting, Golub and Van Loan, Matrix
// Computations, 4th ed., algorithms 3.4.1 and 3.1.1–3.1.2), which Newton used before the
// one-pass luFactorSolve. The one-pass form must give the very same bits, so that no bias point
// changes: every entry of the solution is compared with Object.is (which tells −0 from +0).

/** A deterministic generator (mulberry32), so that a failure can be reproduced. */
function random(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A sparse MNA-like matrix of order n (row stride n + 1) and a right-hand side. */
function system(
  n: number,
  rnd: () => number,
  density: number,
): { a: Float64Array; b: Float64Array } {
  const stride = n + 1;
  const a = new Float64Array(stride * stride);
  const b = new Float64Array(stride);
  const value = (): number => {
    const r = rnd();
    // Magnitudes from 1e-300 to 1e6 (products of tiny entries underflow), exact zeros and −0.
    if (r < 0.05) return -0;
    if (r < 0.1) return 1;
    const magnitude = 10 ** (-300 * rnd() ** 8 + 6 * rnd());
    return rnd() < 0.5 ? -magnitude : magnitude;
  };
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) if (i === j || rnd() < density) a[i * stride + j] = value();
    b[i] = rnd() < 0.2 ? 0 : value();
  }
  // Some rows without a diagonal entry, as a voltage source's branch row has.
  if (n > 1 && rnd() < 0.5) a[(n - 1) * stride + (n - 1)] = 0;
  return { a, b };
}

function twoPhase(a0: Float64Array, b0: Float64Array, n: number): { bad: number; x: number[] } {
  const a = a0.slice();
  const b = b0.slice();
  const perm = new Int32Array(n + 1);
  const bad = luFactor(a, n, n + 1, perm);
  if (bad >= 0) return { bad, x: [] };
  luSolve(a, n, n + 1, perm, b);
  return { bad, x: Array.from(b) };
}

function onePass(a0: Float64Array, b0: Float64Array, n: number): { bad: number; x: number[] } {
  const a = a0.slice();
  const b = b0.slice();
  const bad = luFactorSolve(a, n, n + 1, b, new Int32Array(n * n + n));
  return { bad, x: bad >= 0 ? [] : Array.from(b) };
}

describe('luFactorSolve equals luFactor + luSolve bit for bit (reference: the two-phase form)', () => {
  it('on random sparse systems of order 1 to 30, including singular ones', () => {
    const rnd = random(20261201);
    let solved = 0;
    let singular = 0;
    for (let trial = 0; trial < 3000; trial++) {
      const n = 1 + Math.floor(rnd() * 30);
      const { a, b } = system(n, rnd, 0.05 + 0.5 * rnd());
      const ref = twoPhase(a, b, n);
      const got = onePass(a, b, n);
      expect(got.bad).toBe(ref.bad);
      if (ref.bad >= 0) {
        singular++;
        continue;
      }
      solved++;
      for (let i = 0; i < n; i++) {
        if (!Object.is(got.x[i], ref.x[i]))
          throw new Error(`trial ${trial}, n ${n}: x[${i}] ${got.x[i]} ≠ ${ref.x[i]}`);
      }
    }
    // Both outcomes are exercised.
    expect(solved).toBeGreaterThan(1000);
    expect(singular).toBeGreaterThan(10);
  });

  it('when a multiplier underflows to zero (it is skipped, so −0 on the right stays −0)', () => {
    // m = 1e-300 under the pivot 1e300: m · (1/pivot) = 1e-600 underflows to 0. Subtracting
    // 0 · (−5) = −0 from −0 would give +0; luSolve skips the zero multiplier and keeps −0.
    const a = new Float64Array([1e300, 0, 0, 1e-300, 1, 0, 0, 0, 0]);
    const b = new Float64Array([-5, -0, 0]);
    const ref = twoPhase(a, b, 2);
    expect(Object.is(ref.x[1], -0)).toBe(true);
    expect(onePass(a, b, 2).x.map((v) => Object.is(v, -0))).toEqual(
      ref.x.map((v) => Object.is(v, -0)),
    );
    expect(onePass(a, b, 2).x).toEqual(ref.x);
  });

  it('on a matrix with a NaN or an infinite entry (the singular report)', () => {
    for (const bad of [NaN, Infinity, -Infinity]) {
      const a = new Float64Array([2, 1, 0, bad, 3, 0, 0, 0, 0]);
      const b = new Float64Array([1, 2, 0]);
      expect(onePass(a, b, 2).bad).toBe(twoPhase(a, b, 2).bad);
    }
  });
});
