import { EngineError } from './errors.ts';
import type { MnaSystem } from './mna.ts';
import { newton, type NewtonSettings, type NewtonWork } from './newton.ts';

/**
 * The nonlinear DC solve: plain Newton-Raphson, and SPICE's fallbacks when it fails: gmin
 * stepping (a shunt conductance on every node, lowered decade by decade) and source stepping
 * (all independent sources ramped from zero). Every loop is capped, so a solve always ends.
 */

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
 * The settings of one attempt, built field by field: a spread that adds keys takes V8's slow
 * path (about 2 µs here, the time of four Newton iterations of a ten-device circuit).
 */
function newtonSettings(
  settings: { maxIterations: number; gmin: number },
  diagGmin: number,
  sourceFactor: number,
): NewtonSettings {
  return { maxIterations: settings.maxIterations, gmin: settings.gmin, diagGmin, sourceFactor };
}

/** Puts work.x at the start of an attempt: `start`, or zero with SPICE's junction guesses. */
function resetIterate(sys: MnaSystem, work: NewtonWork, start: Float64Array | undefined): void {
  if (start) {
    work.x.set(start);
    seedAll(sys, work.x);
  } else {
    work.x.fill(0);
    seedAll(sys, null);
  }
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
  let total = 0;
  resetIterate(sys, work, start);
  let last = newton(sys, work, newtonSettings(settings, 0, 1));
  total += last.iterations;
  if (last.converged) return { x: work.x, iterations: total, method: 'plain' };
  const plainFailure = last;

  // Gmin stepping: start heavily shunted, relax the shunt while each step converges; on a
  // failed step go back to the last good solution and relax more gently.
  resetIterate(sys, work, start);
  const good = new Float64Array(sys.stride);
  let goodDiag = -1;
  let diag = 1e-2;
  let factor = 10;
  for (let step = 0; step < 200; step++) {
    last = newton(sys, work, newtonSettings(settings, diag, 1));
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
    last = newton(sys, work, newtonSettings(settings, 0, scale));
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
