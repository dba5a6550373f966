/**
 * Dense LU factorization with partial pivoting, in place on a row-major Float64Array.
 *
 * The matrix may be stored with a row stride larger than its order: the MNA assembly keeps one
 * extra row and column as a sink for ground stamps so that device loads need no branches; the
 * factorization simply ignores it. Zero multipliers are skipped, which makes the dense routine
 * exploit most of a circuit matrix's sparsity without any bookkeeping.
 */

/**
 * Factors the leading n×n block of `a` (row stride `stride`) into L·U in place, recording the
 * row exchanges in `perm`. Returns −1 on success, or the column at which no usable pivot was found.
 */
export function luFactor(a: Float64Array, n: number, stride: number, perm: Int32Array): number {
  if (cols.length < n) cols = new Int32Array(n);
  for (let k = 0; k < n; k++) {
    let p = k;
    let max = Math.abs(a[k * stride + k]!);
    for (let i = k + 1; i < n; i++) {
      const v = Math.abs(a[i * stride + k]!);
      if (v > max) {
        max = v;
        p = i;
      }
    }
    perm[k] = p;
    if (!(max > 0) || !Number.isFinite(max)) return k;
    if (p !== k) swapRows(a, k, p, n, stride);
    const rowK = k * stride;
    const inv = 1 / a[rowK + k]!;
    // The pivot row's nonzeros, gathered once, bound the work of every elimination below it.
    let count = 0;
    for (let j = k + 1; j < n; j++) if (a[rowK + j] !== 0) cols[count++] = j;
    for (let i = k + 1; i < n; i++) {
      const rowI = i * stride;
      const m = a[rowI + k]!;
      if (m === 0) continue;
      const f = m * inv;
      a[rowI + k] = f;
      for (let t = 0; t < count; t++) {
        const j = cols[t]!;
        a[rowI + j]! -= f * a[rowK + j]!;
      }
    }
  }
  return -1;
}

let cols = new Int32Array(64);

function swapRows(a: Float64Array, r1: number, r2: number, n: number, stride: number): void {
  const o1 = r1 * stride;
  const o2 = r2 * stride;
  for (let j = 0; j < n; j++) {
    const t = a[o1 + j]!;
    a[o1 + j] = a[o2 + j]!;
    a[o2 + j] = t;
  }
}

/** Solves (L·U)·x = P·b in place in `b`, using the factors and exchanges from {@link luFactor}. */
export function luSolve(
  a: Float64Array,
  n: number,
  stride: number,
  perm: Int32Array,
  b: Float64Array,
): void {
  for (let k = 0; k < n; k++) {
    const p = perm[k]!;
    if (p !== k) {
      const t = b[k]!;
      b[k] = b[p]!;
      b[p] = t;
    }
  }
  for (let i = 1; i < n; i++) {
    const row = i * stride;
    let s = b[i]!;
    for (let j = 0; j < i; j++) {
      const l = a[row + j]!;
      if (l !== 0) s -= l * b[j]!;
    }
    b[i] = s;
  }
  for (let i = n - 1; i >= 0; i--) {
    const row = i * stride;
    let s = b[i]!;
    for (let j = i + 1; j < n; j++) {
      const u = a[row + j]!;
      if (u !== 0) s -= u * b[j]!;
    }
    b[i] = s / a[row + i]!;
  }
}
