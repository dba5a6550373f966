import { z } from 'zod';
import type { CircuitInput } from '../circuit.ts';
import { EngineError, isEngineError } from '../errors.ts';
import type { OperatingPoint } from '../operating-point.ts';
import { resolveOperatingPointOptions, type ResolvedOperatingPointOptions } from '../options.ts';
import { prepareOperatingPoint, solvePreparedResolved, type PreparedCircuit } from '../prepared.ts';
import { smallSignalAt } from '../small-signal.ts';
import { modelSlots, type ModelSlots } from './model-slots.ts';
import {
  applyParameters,
  nominalValues,
  resolveParameters,
  type ResolvedParameter,
} from './parameters.ts';
import {
  missingPathReason,
  needsSmallSignal,
  parseResultPath,
  readResultPath,
  type ParsedResultPath,
  type ResultSource,
} from './result-path.ts';
import {
  evaluationSettingsSchema,
  type EvaluationSettings,
  type EvaluationSettingsInput,
} from './settings.ts';
import { parseInput, resultPathSchema, type VariedParameterInput } from './spec.ts';

/**
 * The one place the variation analyses solve a circuit: parameters at given values (and a
 * temperature) in, the probed result paths out. Bias-point paths go through the prepared path
 * (validated and compiled once; each variant only re-stamps what it changes); gain and impedance
 * paths add a small-signal analysis of the variant at the settings' frequency.
 */

export interface EvaluatorInput {
  circuit: CircuitInput;
  /** Worksheet analysis settings (diode law, temperature, input source, output node, frequency). */
  settings?: EvaluationSettingsInput | undefined;
  /** Varied parameters. Default none. */
  parameters?: readonly VariedParameterInput[] | undefined;
  /** Result paths to report. Default none. */
  probes?: readonly string[] | undefined;
}

export interface Evaluator {
  settings: EvaluationSettings;
  parameters: ResolvedParameter[];
  /** The probed paths, trimmed, in the order given. */
  probes: string[];
  /** The parameters' nominal values, in order. */
  nominal: Float64Array;
  /** The probes' values at nominal (settings' temperature). */
  nominalResults: Float64Array;
  /** Probe values with the parameters at `values`, at `temperature` °C (default the settings'); throws EngineError when the variant cannot be solved. */
  evaluate(values: ArrayLike<number>, temperature?: number): Float64Array;
  /** The whole bias point (and small-signal figures when the settings name input and output) of a variant. */
  solve(values: ArrayLike<number>, temperature?: number): ResultSource;
}

const probesSchema = z.array(resultPathSchema).max(100, 'at most 100 result paths');

/** Runs `f`; an EngineError becomes the returned error, anything else is a defect and is thrown. */
export function engineAttempt<T>(
  f: () => T,
): { ok: true; value: T } | { ok: false; error: EngineError } {
  try {
    return { ok: true, value: f() };
  } catch (error) {
    if (isEngineError(error)) return { ok: false, error };
    throw error;
  }
}

/** Validates the circuit, settings, parameters and probes; throws EngineError on bad input or when the nominal circuit cannot be solved. */
export function createEvaluator(input: EvaluatorInput): Evaluator {
  const settings = parseInput(evaluationSettingsSchema, input.settings, 'settings');
  const probes = parseInput(probesSchema, input.probes ?? [], 'probes');
  const parsed: ParsedResultPath[] = probes.map(parseResultPath);
  const withSignal = parsed.some(needsSmallSignal);
  const hasSignalSettings = settings.inputSource !== '' && settings.outputNode !== '';
  if (withSignal && !hasSignalSettings) {
    const path = probes[parsed.findIndex(needsSmallSignal)]!;
    throw new EngineError(
      'bad-option',
      `result path '${path}': the gain and impedances need the input source and the output node in the settings`,
    );
  }
  const bases = new Map<number, PreparedCircuit>();
  const first = prepareOperatingPoint(input.circuit, { temperature: settings.temperature });
  bases.set(settings.temperature, first);
  const parameters = resolveParameters(first, input.parameters ?? []);
  const options = new Map<number, ResolvedOperatingPointOptions>();

  const optionsAt = (temperature: number): ResolvedOperatingPointOptions => {
    let o = options.get(temperature);
    if (!o) {
      o = resolveOperatingPointOptions({
        temperature,
        diodeLaw: settings.diodeLaw,
        constantDrop: settings.constantDrop,
        piecewiseLinear: settings.piecewiseLinear,
      });
      options.set(temperature, o);
    }
    return o;
  };
  // One base per temperature, compiled there, so the variants of a sweep share its compilation.
  const baseAt = (temperature: number): PreparedCircuit => {
    let b = bases.get(temperature);
    if (!b) {
      b = prepareOperatingPoint(input.circuit, { temperature });
      bases.set(temperature, b);
    }
    return b;
  };
  const signalOf = (variant: PreparedCircuit, temperature: number): ResultSource['smallSignal'] =>
    smallSignalAt(variant.circuit, {
      input: settings.inputSource,
      output: settings.outputNode,
      frequency: settings.frequency,
      temperature,
    });
  // Per temperature, the stamps the model parameters' variants reuse (model-slots.ts).
  const slotsByTemperature = new Map<number, Map<string, ModelSlots>>();
  const slotsAt = (temperature: number): Map<string, ModelSlots> => {
    let slots = slotsByTemperature.get(temperature);
    if (!slots) {
      const base = baseAt(temperature);
      slots = new Map();
      for (const p of parameters)
        if (p.kind === 'model' && !slots.has(p.owner))
          slots.set(p.owner, modelSlots(base, p.owner));
      slotsByTemperature.set(temperature, slots);
    }
    return slots;
  };
  const solveVariant = (
    values: ArrayLike<number>,
    temperature: number,
    signal: boolean,
  ): ResultSource => {
    const variant = applyParameters(
      baseAt(temperature),
      parameters,
      values,
      temperature,
      slotsAt(temperature),
    );
    const bias: OperatingPoint = solvePreparedResolved(variant, optionsAt(temperature));
    return { bias, smallSignal: signal ? signalOf(variant, temperature) : undefined };
  };

  const evaluate = (
    values: ArrayLike<number>,
    temperature = settings.temperature,
  ): Float64Array => {
    const source = solveVariant(values, temperature, withSignal);
    const out = new Float64Array(parsed.length);
    for (let i = 0; i < parsed.length; i++) out[i] = readResultPath(source, parsed[i]!) ?? NaN;
    return out;
  };
  const nominal = nominalValues(parameters);
  const source = solveVariant(nominal, settings.temperature, withSignal);
  const nominalResults = new Float64Array(parsed.length);
  parsed.forEach((p, i) => {
    const value = readResultPath(source, p);
    if (value === undefined)
      throw new EngineError('bad-option', missingPathReason(source, p, probes[i]!));
    nominalResults[i] = value;
  });
  return {
    settings,
    parameters,
    probes,
    nominal,
    nominalResults,
    evaluate,
    solve: (values, temperature = settings.temperature) =>
      solveVariant(values, temperature, hasSignalSettings),
  };
}

/** `{path: value}` of an evaluator's probes. */
export function probeRecord(
  probes: readonly string[],
  values: ArrayLike<number>,
): Record<string, number> {
  const out: Record<string, number> = {};
  probes.forEach((p, i) => (out[p] = values[i]!));
  return out;
}

/** `{parameter id: value}` of an evaluator's parameters. */
export function parameterRecord(
  parameters: readonly ResolvedParameter[],
  values: ArrayLike<number>,
): Record<string, number> {
  const out: Record<string, number> = {};
  parameters.forEach((p, i) => (out[p.id] = values[i]!));
  return out;
}
