import { z } from 'zod';
import { DEFAULT_TEMPERATURE_C } from './constants.ts';
import { EngineError } from './errors.ts';

/**
 * Options of the bias-point solve, validated and defaulted once here so that the numerics can
 * trust them.
 */

/** Large-signal law used for every diode (BJTs and MOSFETs always use their full models). */
export type DiodeLaw = 'exponential' | 'ideal' | 'constant-drop' | 'piecewise-linear';

/** The diode laws, in the order the model comparison lists them. */
export const DIODE_LAWS: readonly DiodeLaw[] = [
  'exponential',
  'piecewise-linear',
  'constant-drop',
  'ideal',
];

export interface OperatingPointOptions {
  /** Circuit temperature, °C. Default 27. */
  temperature?: number;
  /** Temperature at which model parameters were measured (TNOM), °C. Default 27; a card's TNOM overrides it. */
  nominalTemperature?: number;
  /** Diode law. Default `exponential`. */
  diodeLaw?: DiodeLaw;
  /** Constant-drop law: forward drop `vOn`, V. Default 0.7 V (common practice for silicon). */
  constantDrop?: { vOn?: number };
  /** Piecewise-linear law: knee `v0` (V, default 0.6 V) and slope resistance `rd` (Ω, default 20 Ω) — common practice values. */
  piecewiseLinear?: { v0?: number; rd?: number };
  /** Conductance across every junction (and every off diode of a simplified law), S. Default 1e-12, as SPICE. */
  gmin?: number;
  /** Newton iteration cap of one attempt (plain, each gmin step, each source step). Default 200. */
  maxIterations?: number;
}

export interface ResolvedOperatingPointOptions {
  /** °C. */
  temperature: number;
  /** °C. */
  nominalTemperature: number;
  diodeLaw: DiodeLaw;
  /** Forward drop of the constant-drop law, V. */
  constantDropVoltage: number;
  /** Knee of the piecewise-linear law, V. */
  pwlKnee: number;
  /** Slope resistance of the piecewise-linear law, Ω. */
  pwlResistance: number;
  /** S. */
  gmin: number;
  maxIterations: number;
}

const temperature = z
  .number()
  .finite()
  .min(-273.15 + 1, 'temperature must be above absolute zero')
  .max(1000);
const optionsSchema = z.object({
  temperature: temperature.default(DEFAULT_TEMPERATURE_C),
  nominalTemperature: temperature.default(DEFAULT_TEMPERATURE_C),
  diodeLaw: z
    .enum(['exponential', 'ideal', 'constant-drop', 'piecewise-linear'])
    .default('exponential'),
  constantDrop: z
    .object({ vOn: z.number().finite().min(0).max(100).default(0.7) })
    .default({ vOn: 0.7 }),
  piecewiseLinear: z
    .object({
      v0: z.number().finite().min(0).max(100).default(0.6),
      rd: z.number().finite().min(0).default(20),
    })
    .default({ v0: 0.6, rd: 20 }),
  gmin: z.number().finite().min(0).max(1e-3).default(1e-12),
  maxIterations: z.number().int().min(1).max(100_000).default(200),
});

/** Converts a zod failure on options into the engine's `bad-option` error. */
export function optionError(error: z.ZodError): EngineError {
  const issue = error.issues[0]!;
  return new EngineError(
    'bad-option',
    `option ${issue.path.join('.') || '(options)'}: ${issue.message}`,
  );
}

let defaults: ResolvedOperatingPointOptions | undefined;

export function resolveOperatingPointOptions(
  options?: OperatingPointOptions,
): ResolvedOperatingPointOptions {
  // Most solves use the defaults; skip the schema for them.
  if (options === undefined || allUndefined(options)) return { ...(defaults ??= resolve({})) };
  return resolve(options);
}

function allUndefined(options: OperatingPointOptions): boolean {
  for (const value of Object.values(options)) if (value !== undefined) return false;
  return true;
}

function resolve(options: OperatingPointOptions): ResolvedOperatingPointOptions {
  const parsed = optionsSchema.safeParse(options);
  if (!parsed.success) throw optionError(parsed.error);
  const o = parsed.data;
  return {
    temperature: o.temperature,
    nominalTemperature: o.nominalTemperature,
    diodeLaw: o.diodeLaw,
    constantDropVoltage: o.constantDrop.vOn,
    pwlKnee: o.piecewiseLinear.v0,
    pwlResistance: o.piecewiseLinear.rd,
    gmin: o.gmin,
    maxIterations: o.maxIterations,
  };
}
