import type { CircuitInput } from './circuit.ts';
import { buildSystem, type MnaSystem } from './mna.ts';
import { createWork } from './newton.ts';
import { solveNonlinear } from './solve-nonlinear.ts';
import { buildOperatingPoint, type OperatingPoint } from './operating-point.ts';
import {
  resolveOperatingPointOptions,
  type OperatingPointOptions,
  type ResolvedOperatingPointOptions,
} from './options.ts';
import { solvePreparedResolved, validateForSolve } from './prepared.ts';
import type { ValidatedCircuit } from './topology.ts';

export type { DiodeLaw, OperatingPointOptions } from './options.ts';
export {
  prepareOperatingPoint,
  solvePreparedOperatingPoint,
  withElementValue,
  type PreparedCircuit,
} from './prepared.ts';
export type { BjtOp, DeviceOp, DiodeOp, MosfetOp, OperatingPoint } from './operating-point.ts';

/** A solved bias point together with the system it was solved on (for linearization). */
export interface SolvedBias {
  validated: ValidatedCircuit;
  options: ResolvedOperatingPointOptions;
  system: MnaSystem;
  /** Solution vector of `system` (x[ground] = 0). */
  x: Float64Array;
  op: OperatingPoint;
}

/** Solves an already validated circuit with the exponential law for every device. */
export function solveValidated(
  validated: ValidatedCircuit,
  options: ResolvedOperatingPointOptions,
): SolvedBias {
  const system = buildSystem(validated, {
    temperature: options.temperature,
    nominalTemperature: options.nominalTemperature,
  });
  const work = createWork(system);
  const r = solveNonlinear(system, work, {
    maxIterations: options.maxIterations,
    gmin: options.gmin,
  });
  const op = buildOperatingPoint(system, r.x, {
    iterations: r.iterations,
    method: r.method,
    temperature: options.temperature,
    diodeLaw: 'exponential',
    gmin: options.gmin,
    warnings: validated.warnings,
  });
  return { validated, options, system, x: r.x, op };
}

/**
 * The bias point (DC operating point) of a circuit: node voltages, source currents, every
 * device's operating quantities and region, every element's current and power.
 * Throws EngineError naming the element or node when the circuit cannot be solved.
 */
export function solveOperatingPoint(
  circuit: CircuitInput,
  options?: OperatingPointOptions,
): OperatingPoint {
  const resolved = resolveOperatingPointOptions(options);
  return solvePreparedResolved(validateForSolve(circuit), resolved);
}
