import { luFactorSolve } from './lu.ts';
import type { MnaSystem } from './mna.ts';

/**
 * One Newton-Raphson attempt on the MNA system (solve-nonlinear.ts adds SPICE's fallbacks).
 * The iteration allocates nothing: the matrix, right-hand side, iterate and pivots live in a
 * NewtonWork made once per system, and the device stamps write into them in place.
 */

/** Relative change of every unknown at convergence. */
export const RELATIVE_TOLERANCE = 1e-9;
/** Absolute change allowed on a node voltage near 0 V, V. */
export const VOLTAGE_TOLERANCE = 1e-12;
/** Absolute change allowed on a branch current near 0 A, A. */
export const CURRENT_TOLERANCE = 1e-15;
/** KCL residual allowed at every node, A (plus round-off of the node's largest current terms). */
export const RESIDUAL_TOLERANCE = 1e-12;
/** Largest node voltage the engine accepts as a plausible iterate, V. */
const DIVERGED_VOLTAGE = 1e9;
const EPS = Number.EPSILON;

export interface NewtonSettings {
  /** Iteration cap of one attempt. */
  maxIterations: number;
  /** Conductance across every junction, S. */
  gmin: number;
  /** Extra conductance from every node to ground (gmin stepping), S; 0 normally. */
  diagGmin: number;
  /** Scale of every independent source (source stepping), 0…1. */
  sourceFactor: number;
}

/** Buffers reused across iterations and attempts of one system. */
export interface NewtonWork {
  a: Float64Array;
  b: Float64Array;
  /** Scratch of luFactorSolve: U's nonzero columns, row by row, and their counts (n² + n). */
  cols: Int32Array;
  /** Current iterate; x[ground] stays 0. */
  x: Float64Array;
  /** The assembled matrix and right-hand side before factoring, for the residual. */
  saved: Float64Array;
  rhs: Float64Array;
  /** Where kclResidual reports the largest residual (A) and its node (an unknown index). */
  kcl: { residual: number; node: number };
}

export function createWork(sys: MnaSystem): NewtonWork {
  const n = sys.stride;
  const square = n * n;
  // One backing store for all the buffers: a typed array with a store of its own costs an
  // allocation outside the heap, which would dominate setting up a small circuit.
  const pool = new ArrayBuffer(8 * (2 * square + 3 * n) + 4 * (square + n));
  return {
    a: new Float64Array(pool, 0, square),
    saved: new Float64Array(pool, 8 * square, square),
    b: new Float64Array(pool, 8 * 2 * square, n),
    x: new Float64Array(pool, 8 * (2 * square + n), n),
    rhs: new Float64Array(pool, 8 * (2 * square + 2 * n), n),
    cols: new Int32Array(pool, 8 * (2 * square + 3 * n), square + n),
    kcl: { residual: 0, node: 0 },
  };
}

export interface NewtonOutcome {
  converged: boolean;
  /** Why an attempt stopped without converging. */
  failure?: 'iteration-cap' | 'diverged' | 'singular';
  iterations: number;
  /** Largest KCL residual at the last linearization point, A. */
  residual: number;
  /** Unknown index of the node with that residual. */
  worstNode: number;
}

/** Assembles the linearized system at work.x into work.a / work.b; returns true if any step was limited. */
export function assemble(sys: MnaSystem, work: NewtonWork, s: NewtonSettings): boolean {
  const { a, b, x } = work;
  a.set(sys.g0);
  const f = s.sourceFactor;
  const b0 = sys.b0;
  if (f === 1) b.set(b0);
  else for (let i = 0; i < sys.stride; i++) b[i] = f * b0[i]!;
  if (s.diagGmin > 0) for (let i = 0; i < sys.nodeCount; i++) a[i * sys.stride + i]! += s.diagGmin;
  let limited = false;
  for (const d of sys.devices) if (d.load(x, a, b, s.gmin)) limited = true;
  return limited;
}

/**
 * Largest KCL residual of the assembled system (matrix `a` before factoring) at x, written to
 * `out`; true when every node is within tolerance.
 */
function kclResidual(
  sys: MnaSystem,
  a: Float64Array,
  b: Float64Array,
  x: Float64Array,
  out: NewtonWork['kcl'],
): boolean {
  const { size, stride, nodeCount } = sys;
  let residual = 0;
  let node = 0;
  let ok = true;
  for (let i = 0; i < nodeCount; i++) {
    const row = i * stride;
    let sum = -b[i]!;
    let scale = Math.abs(b[i]!);
    for (let j = 0; j < size; j++) {
      const aij = a[row + j]!;
      if (aij !== 0) {
        const t = aij * x[j]!;
        sum += t;
        scale += Math.abs(t);
      }
    }
    const r = Math.abs(sum);
    if (r > residual) {
      residual = r;
      node = i;
    }
    if (r > RESIDUAL_TOLERANCE + 16 * EPS * scale) ok = false;
  }
  out.residual = residual;
  out.node = node;
  return ok;
}

/**
 * One Newton attempt from work.x (devices must have been seeded). Converged when no junction
 * step was limited, the update is within the relative tolerance, and the KCL residual at the
 * linearization point is within RESIDUAL_TOLERANCE; the returned iterate is the updated one.
 */
export function newton(sys: MnaSystem, work: NewtonWork, s: NewtonSettings): NewtonOutcome {
  const { a, b, cols, x, saved, rhs, kcl } = work;
  const { size, stride, nodeCount, ground } = sys;
  let residual = Infinity;
  let worstNode = 0;
  for (let it = 1; it <= s.maxIterations; it++) {
    const limited = assemble(sys, work, s);
    // The residual is needed only when no step was limited and the step turns out small; keep
    // the system (the factorization overwrites it) for that case only.
    if (!limited) {
      saved.set(a);
      rhs.set(b);
    }
    const bad = luFactorSolve(a, size, stride, b, cols);
    if (bad >= 0)
      return { converged: false, failure: 'singular', iterations: it, residual, worstNode: bad };
    let vmax = 0;
    let vmaxNode = 0;
    for (let i = 0; i < nodeCount; i++) {
      const v = Math.abs(b[i]!);
      if (!(v <= vmax)) {
        vmax = v;
        vmaxNode = i;
      }
    }
    if (!(vmax < DIVERGED_VOLTAGE))
      return {
        converged: false,
        failure: 'diverged',
        iterations: it,
        residual,
        worstNode: vmaxNode,
      };
    // The step size matters only when no junction was limited (and only until one unknown
    // moved too far); every unknown is still checked for NaN and infinity.
    let small = !limited;
    const vFloor = VOLTAGE_TOLERANCE + 1e-13 * vmax;
    for (let i = 0; i < size; i++) {
      const xn = b[i]!;
      if (!Number.isFinite(xn))
        return { converged: false, failure: 'diverged', iterations: it, residual, worstNode: i };
      if (!small) continue;
      const xo = x[i]!;
      const tol =
        RELATIVE_TOLERANCE * Math.max(Math.abs(xn), Math.abs(xo)) +
        (i < nodeCount ? vFloor : CURRENT_TOLERANCE);
      if (Math.abs(xn - xo) > tol) small = false;
    }
    let ok = false;
    if (small) {
      ok = kclResidual(sys, saved, rhs, x, kcl);
      residual = kcl.residual;
      worstNode = kcl.node;
    }
    for (let i = 0; i < size; i++) x[i] = b[i]!;
    x[ground] = 0;
    if (ok) return { converged: true, iterations: it, residual, worstNode };
  }
  if (!Number.isFinite(residual)) {
    // Report where the last linearization leaves the most current unbalanced.
    assemble(sys, work, s);
    kclResidual(sys, a, b, x, kcl);
    residual = kcl.residual;
    worstNode = kcl.node;
  }
  return {
    converged: false,
    failure: 'iteration-cap',
    iterations: s.maxIterations,
    residual,
    worstNode,
  };
}
