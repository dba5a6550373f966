import type { CircuitInput } from './circuit.ts';
import { solveAssumedState } from './assumed-state.ts';
import { buildSystem, type MnaSystem } from './mna.ts';
import { createWork, solveNonlinear } from './newton.ts';
import { buildOperatingPoint, type OperatingPoint } from './operating-point.ts';
import {
  resolveOperatingPointOptions,
  type OperatingPointOptions,
  type ResolvedOperatingPointOptions,
} from './options.ts';
import { prepareCircuit, type ValidatedCircuit } from './topology.ts';

export type { DiodeLaw, OperatingPointOptions } from './options.ts';
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

/** A circuit validated and topology-checked once, for repeated solves (temperature sweeps, option changes). */
export type PreparedCircuit = ValidatedCircuit;

/** Validates a circuit once (schema, names, models, topology); throws EngineError like solveOperatingPoint. */
export function prepareOperatingPoint(circuit: CircuitInput): PreparedCircuit {
  return prepareCircuit(circuit);
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
  return solveResolved(prepareCircuit(circuit), resolved);
}

/** The bias point of a prepared circuit; every solve starts afresh (no reuse of an earlier answer). */
export function solvePreparedOperatingPoint(
  prepared: PreparedCircuit,
  options?: OperatingPointOptions,
): OperatingPoint {
  return solveResolved(prepared, resolveOperatingPointOptions(options));
}

function solveResolved(
  validated: ValidatedCircuit,
  resolved: ResolvedOperatingPointOptions,
): OperatingPoint {
  const hasDiodes = validated.circuit.elements.some((el) => el.kind === 'D');
  if (resolved.diodeLaw !== 'exponential' && hasDiodes)
    return solveAssumedState(validated, resolved);
  const op = solveValidated(validated, resolved).op;
  op.diodeLaw = resolved.diodeLaw;
  return op;
}
