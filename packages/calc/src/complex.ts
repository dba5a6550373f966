/**
 * Complex dense LU for the small-signal (AC) system, on split real and imaginary arrays so that
 * the storage stays two plain Float64Arrays (no per-entry objects). Same layout as lu.ts.
 */

/** A complex number as a plain pair. */
export interface Complex {
  /** Real part. */
  re: number;
  /** Imaginary part. */
  im: number;
}

/** |z|. */
export function cabs(z: Complex): number {
  return Math.hypot(z.re, z.im);
}

/** Phase of z in degrees, in (−180°, 180°]. */
export function cargDeg(z: Complex): number {
  return (Math.atan2(z.im, z.re) * 180) / Math.PI;
}

/** a / b. */
export function cdiv(a: Complex, b: Complex): Complex {
  const d = b.re * b.re + b.im * b.im;
  return { re: (a.re * b.re + a.im * b.im) / d, im: (a.im * b.re - a.re * b.im) / d };
}

/**
 * Factors the leading n×n block of the complex matrix (re, im) in place with partial pivoting
 * on |a|. Returns −1 on success or the column without a usable pivot.
 */
export function complexLuFactor(
  re: Float64Array,
  im: Float64Array,
  n: number,
  stride: number,
  perm: Int32Array,
): number {
  for (let k = 0; k < n; k++) {
    let p = k;
    let max = -1;
    for (let i = k; i < n; i++) {
      const o = i * stride + k;
      const v = Math.abs(re[o]!) + Math.abs(im[o]!);
      if (v > max) {
        max = v;
        p = i;
      }
    }
    perm[k] = p;
    if (!(max > 0) || !Number.isFinite(max)) return k;
    if (p !== k) {
      const o1 = k * stride;
      const o2 = p * stride;
      for (let j = 0; j < n; j++) {
        let t = re[o1 + j]!;
        re[o1 + j] = re[o2 + j]!;
        re[o2 + j] = t;
        t = im[o1 + j]!;
        im[o1 + j] = im[o2 + j]!;
        im[o2 + j] = t;
      }
    }
    const rowK = k * stride;
    const pr = re[rowK + k]!;
    const pi = im[rowK + k]!;
    const pd = pr * pr + pi * pi;
    for (let i = k + 1; i < n; i++) {
      const rowI = i * stride;
      const mr = re[rowI + k]!;
      const mi = im[rowI + k]!;
      if (mr === 0 && mi === 0) continue;
      const fr = (mr * pr + mi * pi) / pd;
      const fi = (mi * pr - mr * pi) / pd;
      re[rowI + k] = fr;
      im[rowI + k] = fi;
      for (let j = k + 1; j < n; j++) {
        const ur = re[rowK + j]!;
        const ui = im[rowK + j]!;
        if (ur === 0 && ui === 0) continue;
        re[rowI + j]! -= fr * ur - fi * ui;
        im[rowI + j]! -= fr * ui + fi * ur;
      }
    }
  }
  return -1;
}

/** Solves the factored complex system in place in (br, bi). */
export function complexLuSolve(
  re: Float64Array,
  im: Float64Array,
  n: number,
  stride: number,
  perm: Int32Array,
  br: Float64Array,
  bi: Float64Array,
): void {
  for (let k = 0; k < n; k++) {
    const p = perm[k]!;
    if (p !== k) {
      let t = br[k]!;
      br[k] = br[p]!;
      br[p] = t;
      t = bi[k]!;
      bi[k] = bi[p]!;
      bi[p] = t;
    }
  }
  for (let i = 1; i < n; i++) {
    const row = i * stride;
    let sr = br[i]!;
    let si = bi[i]!;
    for (let j = 0; j < i; j++) {
      const lr = re[row + j]!;
      const li = im[row + j]!;
      if (lr === 0 && li === 0) continue;
      sr -= lr * br[j]! - li * bi[j]!;
      si -= lr * bi[j]! + li * br[j]!;
    }
    br[i] = sr;
    bi[i] = si;
  }
  for (let i = n - 1; i >= 0; i--) {
    const row = i * stride;
    let sr = br[i]!;
    let si = bi[i]!;
    for (let j = i + 1; j < n; j++) {
      const ur = re[row + j]!;
      const ui = im[row + j]!;
      if (ur === 0 && ui === 0) continue;
      sr -= ur * br[j]! - ui * bi[j]!;
      si -= ur * bi[j]! + ui * br[j]!;
    }
    const dr = re[row + i]!;
    const di = im[row + i]!;
    const d = dr * dr + di * di;
    br[i] = (sr * dr + si * di) / d;
    bi[i] = (si * dr - sr * di) / d;
  }
}
