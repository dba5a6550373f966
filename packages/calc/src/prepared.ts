import type { CircuitInput, Element } from './circuit.ts';
import { solveAssumedState } from './assumed-state.ts';
import { EngineError } from './errors.ts';
import { linearPlan, restampLinear } from './mna-linear.ts';
import { buildSystem, type CompiledElement, type MnaSystem } from './mna.ts';
import { createWork, type NewtonWork } from './newton.ts';
import { solveNonlinear } from './solve-nonlinear.ts';
import { buildOperatingPoint, type OperatingPoint } from './operating-point.ts';
import {
  resolveOperatingPointOptions,
  type OperatingPointOptions,
  type ResolvedOperatingPointOptions,
} from './options.ts';
import { prepareCircuit, type ValidatedCircuit } from './topology.ts';

/**
 * Repeated bias-point solves of one circuit topology, the way a design loop (or ngspice's
 * `alter` + `op`) runs them: validate and compile the circuit once, change element values in the
 * compiled structure, and solve each variant from scratch. Every solve starts Newton from the
 * same initial guess as a cold solve and gives the same result to the last bit: the matrix
 * entries the changed element writes are summed again from all their terms, in the order and
 * with the arithmetic of a first build (mna-linear.ts).
 */

/** The compiled MNA system of a prepared circuit at one temperature. */
export interface CompiledCircuit {
  /** °C. */
  temperature: number;
  /** °C. */
  nominalTemperature: number;
  system: MnaSystem;
  /**
   * Newton's buffers, shared by every variant derived with {@link withElementValue}: a solve
   * copies its answer into the result before it returns, so nothing else keeps them.
   */
  work: NewtonWork;
  /**
   * Which compiled elements the linear stamps in `system.g0`/`system.b0` belong to. Variants
   * share those two buffers (allocating them per variant would cost more than stamping), so a
   * solve re-stamps the entries of the elements that differ when they hold another variant's
   * values.
   */
  stamped: { elements: readonly CompiledElement[] };
}

/** A circuit validated, topology-checked and compiled once, for repeated solves. */
export interface PreparedCircuit extends ValidatedCircuit {
  /**
   * The compiled system (internal). Compiled by {@link prepareOperatingPoint}; replaced when a
   * solve asks for another temperature; undefined until first needed on the cold path.
   */
  compiled: CompiledCircuit | undefined;
}

/** Which temperatures to compile at; resolved options of a solve. */
type CompileTemperatures = Pick<
  ResolvedOperatingPointOptions,
  'temperature' | 'nominalTemperature'
>;

function compile(validated: ValidatedCircuit, t: CompileTemperatures): CompiledCircuit {
  const system = buildSystem(validated, t);
  return {
    temperature: t.temperature,
    nominalTemperature: t.nominalTemperature,
    system,
    work: createWork(system),
    stamped: { elements: system.elements },
  };
}

/** The prepared circuit's system at the solve's temperatures, compiled again only when they differ. */
function compiledAt(prepared: PreparedCircuit, t: CompileTemperatures): CompiledCircuit {
  const c = prepared.compiled;
  if (c && c.temperature === t.temperature && c.nominalTemperature === t.nominalTemperature)
    return c;
  prepared.compiled = compile(prepared, t);
  return prepared.compiled;
}

/** Validates a circuit that an entry point received; nothing is compiled yet. */
export function validateForSolve(circuit: CircuitInput): PreparedCircuit {
  return preparedFrom(prepareCircuit(circuit), undefined);
}

/**
 * A prepared circuit built field by field: a spread with an added field costs microseconds
 * here, and a fixed shape keeps the solve's property reads monomorphic.
 */
function preparedFrom(
  v: ValidatedCircuit,
  compiled: CompiledCircuit | undefined,
  circuit = v.circuit,
): PreparedCircuit {
  return {
    circuit,
    nodes: v.nodes,
    models: v.models,
    cards: v.cards,
    warnings: v.warnings,
    compiled,
  };
}

/**
 * Validates a circuit once (schema, names, models, topology) and compiles its MNA system at
 * the temperature of `options` (default 27 °C); throws EngineError like solveOperatingPoint.
 */
export function prepareOperatingPoint(
  circuit: CircuitInput,
  options?: OperatingPointOptions,
): PreparedCircuit {
  const prepared = validateForSolve(circuit);
  compiledAt(prepared, resolveOperatingPointOptions(options));
  return prepared;
}

// Plain loops rather than findIndex/some with a callback: these run on every alter and solve.
function indexOfElement(elements: readonly Element[], name: string): number {
  for (let i = 0; i < elements.length; i++) if (elements[i]!.name === name) return i;
  return -1;
}

function hasDiode(elements: readonly Element[]): boolean {
  for (const el of elements) if (el.kind === 'D') return true;
  return false;
}

/** The quantity {@link withElementValue} changes on each kind of element. */
function withValue(el: Element, value: number): Element {
  const finite = Number.isFinite(value);
  switch (el.kind) {
    case 'R':
    case 'C':
    case 'L':
      if (!finite || !(value > 0)) {
        const quantity = { R: 'resistance', C: 'capacitance', L: 'inductance' }[el.kind];
        throw new EngineError(
          'bad-value',
          `${el.name}: ${quantity} must be a finite number > 0, not ${value}`,
          { element: el.name },
        );
      }
      return { ...el, value };
    case 'V':
    case 'I':
    case 'E':
    case 'G':
      if (!finite) {
        throw new EngineError(
          'bad-value',
          `${el.name}: value must be a finite number, not ${value}`,
          {
            element: el.name,
          },
        );
      }
      return el.kind === 'V' || el.kind === 'I' ? { ...el, dc: value } : { ...el, gain: value };
    default:
      throw new EngineError(
        'bad-value',
        `${el.name} is a device: it has no single value to change (change its model card in a new circuit)`,
        { element: el.name },
      );
  }
}

/**
 * The prepared circuit with one element's value replaced: a resistor's, capacitor's or
 * inductor's value (Ω, F, H; > 0), a V or I source's DC value (V, A), an E or G source's gain.
 * The original is left as it was. The compiled structure is shared; only the linear stamps the
 * element writes are redone, so the next solve costs no compilation. Throws EngineError `bad-option` for a name
 * that is not in the circuit and `bad-value` for a value the element cannot take (or a D, Q, M).
 */
export function withElementValue(
  prepared: PreparedCircuit,
  name: string,
  value: number,
): PreparedCircuit {
  const key = name.toLowerCase();
  const index = indexOfElement(prepared.circuit.elements, key);
  if (index < 0)
    throw new EngineError('bad-option', `element ${key} is not in the circuit`, { element: key });
  const el = withValue(prepared.circuit.elements[index]!, value);
  const elements = prepared.circuit.elements.slice();
  elements[index] = el;
  const circuit = { ...prepared.circuit, elements };
  const c = prepared.compiled;
  if (!c) return preparedFrom(prepared, undefined, circuit);
  const system = c.system;
  const compiledElements = system.elements.slice();
  compiledElements[index] = { ...system.elements[index]!, el };
  // The linear stamps are redone by the solve (see CompiledCircuit.stamped).
  return preparedFrom(
    prepared,
    { ...c, system: { ...system, elements: compiledElements } },
    circuit,
  );
}

/** The bias point of a prepared circuit; every solve starts afresh (no reuse of an earlier answer). */
export function solvePreparedOperatingPoint(
  prepared: PreparedCircuit,
  options?: OperatingPointOptions,
): OperatingPoint {
  return solvePreparedResolved(prepared, resolveOperatingPointOptions(options));
}

/** The bias point of a prepared circuit with options already resolved. */
export function solvePreparedResolved(
  prepared: PreparedCircuit,
  resolved: ResolvedOperatingPointOptions,
): OperatingPoint {
  if (resolved.diodeLaw !== 'exponential' && hasDiode(prepared.circuit.elements))
    return solveAssumedState(prepared, resolved);
  const compiled = compiledAt(prepared, resolved);
  const { system, work } = compiled;
  const stamped = compiled.stamped;
  if (stamped.elements !== system.elements) {
    // Only the entries of the elements that differ from the stamped variant's are summed again.
    const plan = (system.linearPlan.value ??= linearPlan(system.elements, system.stride));
    restampLinear(stamped.elements, system.elements, plan, system.stride, system.g0, system.b0);
    stamped.elements = system.elements;
  }
  const r = solveNonlinear(system, work, {
    maxIterations: resolved.maxIterations,
    gmin: resolved.gmin,
  });
  return buildOperatingPoint(system, r.x, {
    iterations: r.iterations,
    method: r.method,
    temperature: resolved.temperature,
    diodeLaw: resolved.diodeLaw,
    gmin: resolved.gmin,
    // A copy: results of one prepared circuit must not share a mutable array.
    warnings: prepared.warnings.slice(),
  });
}
