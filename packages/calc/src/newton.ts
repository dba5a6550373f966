import { EngineError } from './errors.ts';
import { luFactor, luSolve } from './lu.ts';
import type { MnaSystem } from './mna.ts';

/**
 * Newton-Raphson on the MNA system, with SPICE's fallbacks when plain iteration fails: gmin
 * stepping (a shunt conductance on every node, lowered decade by decade) and source stepping
 * (all independent sources ramped from zero). Every loop is capped, so a solve always ends.
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
  perm: Int32Array;
  /** Current iterate; x[ground] stays 0. */
  x: Float64Array;
  /** The assembled matrix and right-hand side before factoring, for the residual. */
  saved: Float64Array;
  rhs: Float64Array;
}

export function createWork(sys: MnaSystem): NewtonWork {
  return {
    a: new Float64Array(sys.stride * sys.stride),
    b: new Float64Array(sys.stride),
    perm: new Int32Array(sys.stride),
    x: new Float64Array(sys.stride),
    saved: new Float64Array(sys.stride * sys.stride),
    rhs: new Float64Array(sys.stride),
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
  for (let i = 0; i < sys.stride; i++) b[i] = f * b0[i]!;
  if (s.diagGmin > 0) for (let i = 0; i < sys.nodeCount; i++) a[i * sys.stride + i]! += s.diagGmin;
  let limited = false;
  for (const d of sys.devices) if (d.load(x, a, b, s.gmin)) limited = true;
  return limited;
}

/** Largest KCL residual of the assembled system (matrix `a` before factoring) at x; ok when every node is within tolerance. */
function kclResidual(
  sys: MnaSystem,
  a: Float64Array,
  b: Float64Array,
  x: Float64Array,
): { residual: number; node: number; ok: boolean } {
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
  return { residual, node, ok };
}

/**
 * One Newton attempt from work.x (devices must have been seeded). Converged when no junction
 * step was limited, the update is within the relative tolerance, and the KCL residual at the
 * linearization point is within RESIDUAL_TOLERANCE; the returned iterate is the updated one.
 */
export function newton(sys: MnaSystem, work: NewtonWork, s: NewtonSettings): NewtonOutcome {
  const { a, b, perm, x, saved, rhs } = work;
  const { size, stride, nodeCount, ground } = sys;
  let residual = Infinity;
  let worstNode = 0;
  for (let it = 1; it <= s.maxIterations; it++) {
    const limited = assemble(sys, work, s);
    // The residual is needed only once the step is small; keep the system to compute it then.
    saved.set(a);
    rhs.set(b);
    const bad = luFactor(a, size, stride, perm);
    if (bad >= 0)
      return { converged: false, failure: 'singular', iterations: it, residual, worstNode: bad };
    luSolve(a, size, stride, perm, b);
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
    let small = true;
    const vFloor = VOLTAGE_TOLERANCE + 1e-13 * vmax;
    for (let i = 0; i < size; i++) {
      const xn = b[i]!;
      if (!Number.isFinite(xn))
        return { converged: false, failure: 'diverged', iterations: it, residual, worstNode: i };
      const xo = x[i]!;
      const tol =
        RELATIVE_TOLERANCE * Math.max(Math.abs(xn), Math.abs(xo)) +
        (i < nodeCount ? vFloor : CURRENT_TOLERANCE);
      if (Math.abs(xn - xo) > tol) small = false;
    }
    let ok = false;
    if (small && !limited) {
      const r = kclResidual(sys, saved, rhs, x);
      residual = r.residual;
      worstNode = r.node;
      ok = r.ok;
    }
    for (let i = 0; i < size; i++) x[i] = b[i]!;
    x[ground] = 0;
    if (ok) return { converged: true, iterations: it, residual, worstNode };
  }
  if (!Number.isFinite(residual)) {
    // Report where the last linearization leaves the most current unbalanced.
    assemble(sys, work, s);
    const r = kclResidual(sys, a, b, x);
    residual = r.residual;
    worstNode = r.node;
  }
  return {
    converged: false,
    failure: 'iteration-cap',
    iterations: s.maxIterations,
    residual,
    worstNode,
  };
}

export type SolveMethod = 'plain' | 'gmin-stepping' | 'source-stepping';

export interface SolveResult {
  /** Solution; x[ground] = 0. */
  x: Float64Array;
  iterations: number;
  method: SolveMethod;
}

function seedAll(sys: MnaSystem, x: Float64Array | null): void {
  for (const d of sys.devices) d.seed(x);
}

/**
 * Solves the nonlinear DC system: plain Newton, then gmin stepping, then source stepping.
 * `start` (if given) is the initial iterate; otherwise devices start from SPICE's junction guesses.
 */
export function solveNonlinear(
  sys: MnaSystem,
  work: NewtonWork,
  settings: { maxIterations: number; gmin: number },
  start?: Float64Array,
): SolveResult {
  const base: NewtonSettings = { ...settings, diagGmin: 0, sourceFactor: 1 };
  let total = 0;
  const reset = (): void => {
    if (start) {
      work.x.set(start);
      seedAll(sys, work.x);
    } else {
      work.x.fill(0);
      seedAll(sys, null);
    }
  };
  reset();
  let last = newton(sys, work, base);
  total += last.iterations;
  if (last.converged) return { x: work.x, iterations: total, method: 'plain' };
  const plainFailure = last;

  // Gmin stepping: start heavily shunted, relax the shunt while each step converges; on a
  // failed step go back to the last good solution and relax more gently.
  reset();
  const good = new Float64Array(sys.stride);
  let goodDiag = -1;
  let diag = 1e-2;
  let factor = 10;
  for (let step = 0; step < 200; step++) {
    last = newton(sys, work, { ...base, diagGmin: diag });
    total += last.iterations;
    if (last.converged) {
      if (diag === 0) return { x: work.x, iterations: total, method: 'gmin-stepping' };
      good.set(work.x);
      goodDiag = diag;
    } else {
      if (goodDiag < 0) break;
      factor = Math.sqrt(factor);
      if (factor < 1.00005) break;
      work.x.set(good);
      seedAll(sys, work.x);
    }
    diag = goodDiag / factor < settings.gmin ? 0 : goodDiag / factor;
  }

  // Source stepping: ramp every independent source from zero.
  work.x.fill(0);
  seedAll(sys, null);
  let goodScale = -1;
  let scale = 0;
  let ds = 0.1;
  for (let step = 0; step < 1000; step++) {
    last = newton(sys, work, { ...base, sourceFactor: scale });
    total += last.iterations;
    if (last.converged) {
      if (scale === 1) return { x: work.x, iterations: total, method: 'source-stepping' };
      good.set(work.x);
      goodScale = scale;
      ds = Math.min(ds * 1.5, 0.5);
    } else {
      if (goodScale < 0) break;
      ds /= 4;
      if (ds < 1e-7) break;
      work.x.set(good);
      seedAll(sys, work.x);
    }
    scale = Math.min(1, goodScale + ds);
  }
  const worst = plainFailure;
  const node = sys.unknownNames[worst.worstNode] ?? '?';
  const where =
    worst.failure === 'iteration-cap' && Number.isFinite(worst.residual)
      ? `largest KCL residual ${worst.residual.toExponential(3)} A at node ${node}`
      : worst.failure === 'singular'
        ? `the linearized circuit is singular at ${node}`
        : `the voltage at ${node} ran away (an exponential junction driven far beyond its knee?)`;
  throw new EngineError(
    'no-convergence',
    `the bias point did not converge (plain Newton, gmin stepping and source stepping all failed): ${where}`,
    { node },
  );
}
