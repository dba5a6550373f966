import type { DeviceModel, Element } from '../circuit.ts';
import { toKelvin } from '../constants.ts';
import { EngineError } from '../errors.ts';
import {
  compileDevice,
  internalNodesOf,
  type CompiledElement,
  type DeviceScaling,
} from '../mna.ts';
import { MODEL_DEFAULTS, defaultFamily, resolveModelParams } from '../models/defaults.ts';
import type { CompiledCircuit, PreparedCircuit } from '../prepared.ts';

/**
 * The model-card counterpart of withElementValue: a prepared circuit with some parameters of one
 * model replaced. Only the devices that use the model get new stamps (their temperature-scaled
 * parameters and series resistances); the rest of the compiled system is shared, so a Monte Carlo
 * sample that varies BF costs no compilation. When the change moves a series resistance between
 * zero and non-zero (the device gains or loses an internal node), the variant is compiled afresh
 * on its first solve instead.
 */

const INTERNAL_SUFFIXES = ['a', 'c', 'b', 'e', 'd', 's'] as const;

/** The parameters the engine evaluates for a model kind, upper case. */
export function evaluatedParameters(model: DeviceModel): string[] {
  return Object.keys(MODEL_DEFAULTS[defaultFamily(model.kind)]);
}

/** Throws `bad-option` unless `param` is a parameter the engine evaluates for this model. */
export function checkModelParameter(model: DeviceModel, param: string): string {
  const upper = param.toUpperCase();
  const known = evaluatedParameters(model);
  if (!known.includes(upper)) {
    throw new EngineError(
      'bad-option',
      `model ${model.name.toLowerCase()} has no parameter ${upper} that the engine evaluates (${model.kind}: ${known.join(', ')})`,
    );
  }
  return upper;
}

const internalIndex = new WeakMap<readonly string[], Map<string, number>>();

function indexOfUnknown(names: readonly string[], name: string): number | undefined {
  let map = internalIndex.get(names);
  if (!map) {
    map = new Map(names.map((n, i) => [n, i]));
    internalIndex.set(names, map);
  }
  return map.get(name);
}

/** The device's internal nodes in the compiled system, or undefined when the new card needs others. */
export function sameInternals(
  el: Element,
  cards: Map<string, Record<string, number>>,
  unknownNames: readonly string[],
): Record<string, number> | undefined {
  const wanted = Object.keys(internalNodesOf(el, cards, false, []));
  const out: Record<string, number> = {};
  for (const suffix of INTERNAL_SUFFIXES) {
    const index = indexOfUnknown(unknownNames, `${el.name}:${suffix}`);
    if ((index !== undefined) !== wanted.includes(suffix)) return undefined;
    if (index !== undefined) out[suffix] = index;
  }
  return out;
}

function sameSeries(a: CompiledElement, b: CompiledElement): boolean {
  if (a.series.length !== b.series.length) return false;
  for (let i = 0; i < a.series.length; i++)
    if (a.series[i]!.label !== b.series[i]!.label) return false;
  return true;
}

/**
 * The prepared circuit with parameters of model `modelName` replaced (names case-insensitive,
 * values SI as on a model card). The original is left as it was. Throws EngineError `bad-option`
 * for a model that is not in the circuit or a parameter the engine does not evaluate, and
 * `bad-value` for a value that is not a finite number.
 */
export function withModelParameters(
  prepared: PreparedCircuit,
  modelName: string,
  params: Readonly<Record<string, number>>,
): PreparedCircuit {
  const key = modelName.toLowerCase();
  const model = prepared.models.get(key);
  if (!model) throw new EngineError('bad-option', `model ${key} is not in the circuit`);
  const changed: Record<string, number> = { ...model.params };
  for (const [name, value] of Object.entries(params)) {
    const upper = checkModelParameter(model, name);
    if (!Number.isFinite(value))
      throw new EngineError(
        'bad-value',
        `model ${key}: ${upper} must be a finite number, not ${value}`,
      );
    changed[upper] = value;
  }
  const nextModel: DeviceModel = { ...model, params: changed };
  const models = new Map(prepared.models);
  models.set(key, nextModel);
  const cards = new Map(prepared.cards);
  if (cards.has(key)) cards.set(key, resolveModelParams(nextModel));
  const circuit = {
    ...prepared.circuit,
    models: prepared.circuit.models.map((m) => (m.name === key ? nextModel : m)),
  };
  const base = { circuit, nodes: prepared.nodes, models, cards, warnings: prepared.warnings };
  return { ...base, compiled: recompiled(prepared.compiled, base, key) };
}

/** The compiled circuit with the stamps of the model's devices made again, or undefined when the topology changes. */
function recompiled(
  c: CompiledCircuit | undefined,
  v: Omit<PreparedCircuit, 'compiled'>,
  model: string,
): CompiledCircuit | undefined {
  if (!c) return undefined;
  const system = c.system;
  const scaling: DeviceScaling = {
    tempK: toKelvin(c.temperature),
    nominalTemperature: c.nominalTemperature,
    scaled: new Map(),
  };
  const elements = system.elements.slice();
  for (let k = 0; k < elements.length; k++) {
    const old = elements[k]!;
    const el = old.el;
    if (!(el.kind === 'D' || el.kind === 'Q' || el.kind === 'M') || el.model !== model) continue;
    const internals = sameInternals(el, v.cards, system.unknownNames);
    if (!internals) return undefined;
    const ce: CompiledElement = { el, terms: old.terms, branch: old.branch, series: [] };
    ce.device = compileDevice(v, el, ce, internals, scaling, system.stride, undefined);
    // A bias-dependent RB moves RB from the linear part into the device, which the plan of the
    // linear stamps does not know.
    if (!sameSeries(old, ce)) return undefined;
    elements[k] = ce;
  }
  const devices = [];
  for (const ce of elements) if (ce.device) devices.push(ce.device);
  return { ...c, system: { ...system, elements, devices } };
}
