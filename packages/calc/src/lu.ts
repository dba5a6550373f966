/**
 * Dense LU factorization with partial pivoting, in place on a row-major Float64Array. Newton
 * uses the one-pass {@link luFactorSolve}; luFactor and luSolve are the two-phase form it is
 * equal to, bit for bit (test/lu.test.ts).
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

/**
 * {@link luFactor} followed by {@link luSolve}, in one pass and with the very same arithmetic:
 * `b` is permuted and forward-substituted while `a` is eliminated, and the next column's pivot
 * is searched while the rows below the pivot are updated. Every entry of `b` and of U sees the
 * same operations in the same order as in the two-phase form (a row's multipliers are applied
 * to its right-hand side in ascending column order, zero multipliers skipped; U's row i is
 * back-substituted over its nonzeros in ascending column order), so the solution is the same
 * to the last bit. What goes is the passes over the matrix that only the two-phase form needs:
 * L is never stored (it is applied to `b` at once), so a row exchange moves only the columns
 * still to be eliminated, and the back substitution visits only the nonzeros of U recorded
 * while eliminating. Solves in place in `b`; `a` is left holding U above the diagonal and
 * scratch below it. `cols` is scratch of length ≥ n·n + n. Returns −1, or the column at which
 * no usable pivot was found (`a` and `b` are then partly processed).
 */
export function luFactorSolve(
  a: Float64Array,
  n: number,
  stride: number,
  b: Float64Array,
  cols: Int32Array,
): number {
  // cols[k·n …] lists the nonzero columns right of the diagonal in U's row k, cols[n·n + k] their number.
  const counts = n * n;
  // Pivot of column 0: the first row with the largest magnitude.
  let p = 0;
  let max = Math.abs(a[0]!);
  for (let i = 1; i < n; i++) {
    const v = Math.abs(a[i * stride]!);
    if (v > max) {
      max = v;
      p = i;
    }
  }
  for (let k = 0; k < n; k++) {
    if (!(max > 0) || max === Infinity) return k;
    const rowK = k * stride;
    const list = k * n;
    let count = 0;
    if (p !== k) {
      const rowP = p * stride;
      const d = a[rowP + k]!;
      a[rowP + k] = a[rowK + k]!;
      a[rowK + k] = d;
      for (let j = k + 1; j < n; j++) {
        const u = a[rowP + j]!;
        a[rowP + j] = a[rowK + j]!;
        a[rowK + j] = u;
        if (u !== 0) cols[list + count++] = j;
      }
      const t = b[k]!;
      b[k] = b[p]!;
      b[p] = t;
    } else {
      for (let j = k + 1; j < n; j++) if (a[rowK + j] !== 0) cols[list + count++] = j;
    }
    cols[counts + k] = count;
    const inv = 1 / a[rowK + k]!;
    const bk = b[k]!;
    const next = k + 1;
    p = next;
    max = 0;
    for (let i = next; i < n; i++) {
      const rowI = i * stride;
      const m = a[rowI + k]!;
      if (m !== 0) {
        const f = m * inv;
        for (let t = list; t < list + count; t++) {
          const j = cols[t]!;
          a[rowI + j]! -= f * a[rowK + j]!;
        }
        // luSolve skips a zero multiplier (m·inv may underflow to 0 when m is not).
        if (f !== 0) b[i]! -= f * bk;
      }
      // The pivot search of column k + 1, as luFactor does it once this step is done: row i
      // is final for column k + 1 now.
      const v = Math.abs(a[rowI + next]!);
      if (i === next) max = v;
      else if (v > max) {
        max = v;
        p = i;
      }
    }
  }
  for (let i = n - 1; i >= 0; i--) {
    const row = i * stride;
    const list = i * n;
    const end = list + cols[counts + i]!;
    let s = b[i]!;
    for (let t = list; t < end; t++) {
      const j = cols[t]!;
      s -= a[row + j]! * b[j]!;
    }
    b[i] = s / a[row + i]!;
  }
  return -1;
}
