import { z } from 'zod';
import { thermalVoltage, toKelvin } from '../constants.ts';
import { createEvaluator, engineAttempt, probeRecord, type EvaluatorInput } from './evaluator.ts';
import { parseInput } from './spec.ts';

/**
 * Results over temperature. The devices scale as SPICE scales them (IS with XTI and EG, VT, BF
 * with XTB, the MOSFET's KP, VTO and PHI; models/*.ts); element values with a temperature
 * coefficient in their varied-parameter entry scale to first order about 27 °C
 * (R(T) = R·(1 + TC·(T − 27 °C)), as SPICE's TC1 with TNOM = 27 °C).
 */

const temperature = z.number().finite().gt(-273.15, 'a temperature must be above absolute zero');
const temperaturesSchema = z.union([
  z.array(temperature).min(1, 'give at least one temperature').max(1000),
  z
    .object({
      from: temperature,
      to: temperature,
      step: z.number().finite().positive('the step must be greater than 0'),
    })
    .refine((r) => r.to >= r.from, { message: 'the range ends below its start' })
    .refine((r) => (r.to - r.from) / r.step <= 1000, { message: 'at most 1000 temperatures' }),
]);
export type TemperatureList = z.input<typeof temperaturesSchema>;

/** The temperatures a list or a range names, in °C; a range includes both ends. */
export function temperaturesOf(list: TemperatureList): number[] {
  const t = parseInput(temperaturesSchema, list, 'temperatures');
  if (Array.isArray(t)) return t;
  const count = Math.floor((t.to - t.from) / t.step + 1e-9);
  const out = Array.from({ length: count + 1 }, (_, i) => t.from + i * t.step);
  if (out[out.length - 1]! < t.to - 1e-9 * t.step) out.push(t.to);
  return out;
}

export interface TemperatureSweepInput extends EvaluatorInput {
  /** °C: a list, or a range {from, to, step}. */
  temperatures: TemperatureList;
  probes: readonly string[];
}

export interface TemperaturePoint {
  /** °C */
  temperature: number;
  ok: boolean;
  /** Probe values by path (when ok). */
  values?: Record<string, number>;
  /** Why the circuit could not be solved at this temperature. */
  error?: { code: string; message: string };
}

export interface TemperatureSweepResult {
  probes: string[];
  points: TemperaturePoint[];
}

/** Every probe at every temperature (parameters at nominal, scaled by their coefficients). */
export function runTemperatureSweep(input: TemperatureSweepInput): TemperatureSweepResult {
  const temperatures = temperaturesOf(input.temperatures);
  const ev = createEvaluator(input);
  const points = temperatures.map((t): TemperaturePoint => {
    const r = engineAttempt(() => ev.evaluate(ev.nominal, t));
    return r.ok
      ? { temperature: t, ok: true, values: probeRecord(ev.probes, r.value) }
      : { temperature: t, ok: false, error: { code: r.error.code, message: r.error.message } };
  });
  return { probes: ev.probes, points };
}

/**
 * dVD/dT of a junction at constant current, V/K: (VD − EG − XTI·VT)/T. It follows from
 * VD = N·VT·ln(I/IS(T)) with SPICE's IS(T) = IS·(T/Tnom)^(XTI/N)·exp((T/Tnom − 1)·EG/(N·VT));
 * N cancels. About −2 mV/K for a silicon diode near 1 mA (common practice). `vd` is the
 * junction voltage (no series-resistance drop) at `temperature` °C.
 */
export function junctionTempco(vd: number, eg: number, xti: number, temperature: number): number {
  return (vd - eg - xti * thermalVoltage(temperature)) / toKelvin(temperature);
}
