import { z } from 'zod';
import { EngineError } from '../errors.ts';
import {
  createEvaluator,
  engineAttempt,
  probeRecord,
  type Evaluator,
  type EvaluatorInput,
} from './evaluator.ts';
import type { ResolvedParameter } from './parameters.ts';
import { parseInput } from './spec.ts';

/**
 * Sensitivities of every probed result to every varied parameter, by central differences about
 * nominal: ∂y/∂x ≈ (y(x + h) − y(x − h))/2h with h = 1e-4·|x| by default. The bias point
 * converges to 1e-9 relative (newton.ts), so the difference carries about 1e-5 relative error.
 * Normalized sensitivity: (∂y/∂x)·(x/y), the % change of the result per % change of the parameter.
 */

export interface SensitivityEntry {
  /** Parameter id (`r1`, `qn.bf`). */
  parameter: string;
  /** ∂y/∂x in result units per parameter unit; null when a perturbed solve failed. */
  absolute: number | null;
  /** (∂y/∂x)·(x/y): % of result per % of parameter; null when x or y is 0 or absolute is null. */
  normalized: number | null;
  /** Why absolute is null. */
  error?: string;
}

export interface SensitivityResult {
  probes: string[];
  /** Probe values at nominal. */
  nominal: Record<string, number>;
  parameters: Pick<ResolvedParameter, 'id' | 'nominal' | 'low' | 'high'>[];
  /** For each probe, one entry per parameter in parameter order. */
  byProbe: Record<string, SensitivityEntry[]>;
}

export interface SensitivityInput extends EvaluatorInput {
  probes: readonly string[];
  /** Step relative to the parameter's value. Default 1e-4. */
  relativeStep?: number | undefined;
}

const stepSchema = z.number().finite().gt(0).max(0.1).default(1e-4);

/** The central-difference step of a parameter. */
function stepOf(p: ResolvedParameter, relative: number): number {
  if (p.nominal !== 0) return relative * Math.abs(p.nominal);
  return p.high !== p.low ? relative * (p.high - p.low) : relative;
}

/** Sensitivities with an evaluator that is already built (corners and RSS reuse one). */
export function sensitivitiesWith(ev: Evaluator, relativeStep = 1e-4): SensitivityResult {
  const byProbe: Record<string, SensitivityEntry[]> = {};
  for (const path of ev.probes) byProbe[path] = [];
  ev.parameters.forEach((p, i) => {
    const h = stepOf(p, relativeStep);
    const values = Float64Array.from(ev.nominal);
    values[i] = p.nominal + h;
    const up = engineAttempt(() => ev.evaluate(values));
    values[i] = p.nominal - h;
    const down = engineAttempt(() => ev.evaluate(values));
    ev.probes.forEach((path, j) => {
      const y = ev.nominalResults[j]!;
      if (!up.ok || !down.ok) {
        const error = (up.ok ? (down as { error: Error }).error : up.error).message;
        byProbe[path]!.push({ parameter: p.id, absolute: null, normalized: null, error });
        return;
      }
      const absolute = (up.value[j]! - down.value[j]!) / (2 * h);
      const normalized = p.nominal === 0 || y === 0 ? null : (absolute * p.nominal) / y;
      byProbe[path]!.push({ parameter: p.id, absolute, normalized });
    });
  });
  return {
    probes: ev.probes,
    nominal: probeRecord(ev.probes, ev.nominalResults),
    parameters: ev.parameters.map(({ id, nominal, low, high }) => ({ id, nominal, low, high })),
    byProbe,
  };
}

/** Validates the input's relative step and probes; throws EngineError `bad-option`. */
export function checkSensitivityInput(input: SensitivityInput, what: string): number {
  if (input.probes.length === 0)
    throw new EngineError('bad-option', `${what}: give at least one result path to probe`);
  return parseInput(stepSchema, input.relativeStep, 'relativeStep');
}

/** Normalized and absolute sensitivities of every probe to every varied parameter. */
export function sensitivities(input: SensitivityInput): SensitivityResult {
  const step = checkSensitivityInput(input, 'sensitivities');
  return sensitivitiesWith(createEvaluator(input), step);
}
