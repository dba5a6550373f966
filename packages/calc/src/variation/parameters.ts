import { z } from 'zod';
import type { Element } from '../circuit.ts';
import { DEFAULT_TEMPERATURE_C } from '../constants.ts';
import { EngineError } from '../errors.ts';
import { resolveModelParams } from '../models/defaults.ts';
import type { PreparedCircuit } from '../prepared.ts';
import { withElementValues } from './element-variant.ts';
import type { ValidatedCircuit } from '../topology.ts';
import type { ModelSlots } from './model-slots.ts';
import { checkModelParameter, withModelParameters } from './model-variant.ts';
import {
  parseInput,
  variedParameterSchema,
  type Distribution,
  type VariedParameterInput,
} from './spec.ts';

/**
 * Varied parameters resolved against a circuit: what each one changes, its nominal value, the
 * ends of its tolerance and its spread, and how a set of values becomes a circuit variant.
 */

export interface ResolvedParameter {
  /** Canonical name, lowercase: the element (`r1`) or `model.param` (`qn.bf`), as results key it. */
  id: string;
  kind: 'element' | 'model';
  /** Element name (kind `element`) or model name (kind `model`), lowercase. */
  owner: string;
  /** Upper-case model parameter (kind `model`). */
  param?: string;
  /** The circuit's value. */
  nominal: number;
  /** Lower and upper end of the tolerance (corners). */
  low: number;
  high: number;
  /** Centre of the distribution: the nominal for a % tolerance, the middle of min/max otherwise. */
  center: number;
  /** Standard deviation of a normal draw, or the half-width of a uniform one. */
  spread: number;
  distribution: Distribution;
  /** ppm/K about 27 °C. */
  tempcoPpm: number;
}

/** The value an element parameter holds, or an error for the kinds that have none. */
function elementValue(el: Element): number {
  switch (el.kind) {
    case 'R':
    case 'C':
    case 'L':
      return el.value;
    case 'V':
    case 'I':
      return el.dc;
    case 'E':
    case 'G':
      return el.gain;
    default:
      throw new EngineError(
        'bad-option',
        `${el.name} is a device: vary a parameter of its model instead (${el.model}.BF, ${el.model}.IS…)`,
        { element: el.name },
      );
  }
}

function owned(
  v: ValidatedCircuit,
  target: string,
): Pick<ResolvedParameter, 'id' | 'kind' | 'owner' | 'param' | 'nominal'> {
  const name = target.toLowerCase();
  const el = v.circuit.elements.find((e) => e.name === name);
  if (el) return { id: name, kind: 'element', owner: name, nominal: elementValue(el) };
  const dot = name.lastIndexOf('.');
  if (dot <= 0) {
    throw new EngineError(
      'bad-option',
      `varied parameter ${name}: no element of that name is in the circuit (use an element name or MODEL.PARAM)`,
      { element: name },
    );
  }
  const modelName = name.slice(0, dot);
  const model = v.models.get(modelName);
  if (!model) {
    throw new EngineError(
      'bad-option',
      `varied parameter ${name}: neither an element ${name} nor a model ${modelName} is in the circuit`,
    );
  }
  const param = checkModelParameter(model, name.slice(dot + 1));
  const nominal = resolveModelParams(model)[param]!;
  return {
    id: `${modelName}.${param.toLowerCase()}`,
    kind: 'model',
    owner: modelName,
    param,
    nominal,
  };
}

/** Resolves varied parameters against a validated circuit; throws EngineError `bad-option` for bad input. */
export function resolveParameters(
  v: ValidatedCircuit,
  inputs: readonly VariedParameterInput[],
): ResolvedParameter[] {
  const specs = parseInput(z.array(variedParameterSchema).max(500), inputs, 'parameters');
  const seen = new Set<string>();
  return specs.map((spec) => {
    const base = owned(v, spec.target);
    if (seen.has(base.id))
      throw new EngineError('bad-option', `varied parameter ${base.id} is given twice`);
    seen.add(base.id);
    let low = base.nominal;
    let high = base.nominal;
    if (spec.tolerancePercent !== undefined) {
      const a = base.nominal * (1 - spec.tolerancePercent / 100);
      const b = base.nominal * (1 + spec.tolerancePercent / 100);
      [low, high] = a <= b ? [a, b] : [b, a];
    } else if (spec.min !== undefined && spec.max !== undefined) {
      [low, high] = [spec.min, spec.max];
    }
    const center = spec.tolerancePercent !== undefined ? base.nominal : (low + high) / 2;
    const halfWidth = (high - low) / 2;
    const spread = spec.distribution === 'normal' ? halfWidth / spec.sigmas : halfWidth;
    return {
      ...base,
      low,
      high,
      center,
      spread,
      distribution: spec.distribution,
      tempcoPpm: spec.tempcoPpm,
    };
  });
}

/** A value at `temperature` (°C) under its first-order coefficient about 27 °C. */
export function atTemperature(value: number, tempcoPpm: number, temperature: number): number {
  if (tempcoPpm === 0) return value;
  return value * (1 + tempcoPpm * 1e-6 * (temperature - DEFAULT_TEMPERATURE_C));
}

/**
 * The prepared circuit with every parameter at its value in `values` (in parameter order),
 * scaled to `temperature` by its coefficient. The base is left unchanged. With `slots` (made for
 * this base, see model-slots.ts) model parameters reuse the base's device stamps, and the variant
 * is valid only until the next one is made.
 */
export function applyParameters(
  base: PreparedCircuit,
  parameters: readonly ResolvedParameter[],
  values: ArrayLike<number>,
  temperature: number,
  slots?: ReadonlyMap<string, ModelSlots>,
): PreparedCircuit {
  const changes = new Map<string, number>();
  let models: Map<string, Record<string, number>> | undefined;
  for (let i = 0; i < parameters.length; i++) {
    const p = parameters[i]!;
    const value = atTemperature(values[i]!, p.tempcoPpm, temperature);
    if (p.kind === 'element') {
      if (value !== p.nominal) changes.set(p.owner, value);
    } else {
      models ??= new Map();
      let params = models.get(p.owner);
      if (!params) models.set(p.owner, (params = {}));
      params[p.param!] = value;
    }
  }
  let variant = withElementValues(base, changes);
  if (models) {
    for (const [model, params] of models) {
      const slot = slots?.get(model);
      variant = slot ? slot.apply(variant, params) : withModelParameters(variant, model, params);
    }
  }
  return variant;
}

/** The nominal value of every parameter, in order. */
export function nominalValues(parameters: readonly ResolvedParameter[]): Float64Array {
  return Float64Array.from(parameters, (p) => p.nominal);
}
