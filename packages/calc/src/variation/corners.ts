import { z } from 'zod';
import { EngineError } from '../errors.ts';
import {
  createEvaluator,
  engineAttempt,
  parameterRecord,
  probeRecord,
  type Evaluator,
  type EvaluatorInput,
} from './evaluator.ts';
import { sensitivitiesWith } from './sensitivities.ts';
import { parseInput } from './spec.ts';

/**
 * Extreme-value analysis. With at most `exhaustiveLimit` (default 12) toleranced parameters every
 * combination of their ends is solved (2^k corners). With more, for each result and direction the
 * search starts from the sensitivity-directed worst case (each parameter at the end that moves
 * the result the wrong way, signs from central differences at nominal) and then flips one
 * parameter at a time while that improves the extreme (a local search), until a whole pass
 * improves nothing. Parameters without a tolerance stay at nominal.
 */

const optionsSchema = z.object({
  exhaustiveLimit: z
    .number()
    .int()
    .min(0)
    .max(16, 'exhaustiveLimit is at most 16 (65 536 corners)')
    .default(12),
});
/** Passes of the local search over all parameters; each pass flips every parameter once. */
const MAX_SEARCH_PASSES = 8;
const REPORTED_FAILURES = 20;

export interface CornersInput extends EvaluatorInput {
  probes: readonly string[];
  /** Most toleranced parameters for which every corner is solved. Default 12. */
  exhaustiveLimit?: number | undefined;
}

export interface CornerProbe {
  nominal: number;
  /** Lowest and highest value over the corners solved; null when none converged. */
  min: number | null;
  max: number | null;
  /** The parameter values (by id) that gave min and max; toleranced parameters only. */
  minAt: Record<string, number>;
  maxAt: Record<string, number>;
}

export interface CornersResult {
  method: 'exhaustive' | 'sensitivity-search';
  /** Corners solved (failed ones included). */
  evaluated: number;
  failed: number;
  /** The first corners that failed, with why. */
  failures: { at: Record<string, number>; message: string }[];
  /** Toleranced parameters and their ends. */
  parameters: { id: string; low: number; high: number }[];
  probes: Record<string, CornerProbe>;
}

/** Corners of an already built evaluator. */
export function cornersWith(ev: Evaluator, exhaustiveLimit = 12): CornersResult {
  const varied = ev.parameters.flatMap((p, i) => (p.high > p.low ? [i] : []));
  const k = varied.length;
  const cache = new Map<string, Float64Array | null>();
  const failures: CornersResult['failures'] = [];
  let failed = 0;
  const valuesOf = (ends: readonly boolean[]): Float64Array => {
    const values = Float64Array.from(ev.nominal);
    varied.forEach(
      (i, j) => (values[i] = ends[j] ? ev.parameters[i]!.high : ev.parameters[i]!.low),
    );
    return values;
  };
  const atOf = (ends: readonly boolean[]): Record<string, number> => {
    const all = parameterRecord(ev.parameters, valuesOf(ends));
    return Object.fromEntries(
      varied.map((i) => [ev.parameters[i]!.id, all[ev.parameters[i]!.id]!]),
    );
  };
  const solve = (ends: readonly boolean[]): Float64Array | null => {
    const key = ends.map((e) => (e ? '1' : '0')).join('');
    if (cache.has(key)) return cache.get(key)!;
    const r = engineAttempt(() => ev.evaluate(valuesOf(ends)));
    if (!r.ok) {
      failed++;
      if (failures.length < REPORTED_FAILURES)
        failures.push({ at: atOf(ends), message: r.error.message });
    }
    const out = r.ok ? r.value : null;
    cache.set(key, out);
    return out;
  };

  const probes: Record<string, CornerProbe> = {};
  const nominal = probeRecord(ev.probes, ev.nominalResults);
  const extremes = ev.probes.map(() => ({
    min: null as { value: number; ends: boolean[] } | null,
    max: null as { value: number; ends: boolean[] } | null,
  }));
  const offer = (ends: boolean[], y: Float64Array): void => {
    extremes.forEach((e, j) => {
      const v = y[j]!;
      if (!Number.isFinite(v)) return;
      if (!e.min || v < e.min.value) e.min = { value: v, ends };
      if (!e.max || v > e.max.value) e.max = { value: v, ends };
    });
  };

  const exhaustive = k <= exhaustiveLimit;
  if (exhaustive) {
    for (let mask = 0; mask < 2 ** k; mask++) {
      const ends = varied.map((_, j) => ((mask >> j) & 1) === 1);
      const y = solve(ends);
      if (y) offer(ends, y);
    }
  } else {
    const sens = sensitivitiesWith(ev);
    ev.probes.forEach((path, j) => {
      for (const direction of [-1, 1]) {
        const better = (a: number, b: number): boolean => (direction > 0 ? a > b : a < b);
        const ends = varied.map((i) => (sens.byProbe[path]![i]!.absolute ?? 0) * direction > 0);
        let best = solve(ends)?.[j] ?? NaN;
        for (let pass = 0; pass < MAX_SEARCH_PASSES; pass++) {
          let improved = false;
          for (let m = 0; m < k; m++) {
            ends[m] = !ends[m];
            const v = solve(ends)?.[j] ?? NaN;
            if (Number.isFinite(v) && (!Number.isFinite(best) || better(v, best))) {
              best = v;
              improved = true;
            } else ends[m] = !ends[m];
          }
          if (!improved) break;
        }
        const y = solve(ends);
        if (y) offer(ends.slice(), y);
      }
    });
  }
  ev.probes.forEach((path, j) => {
    const e = extremes[j]!;
    probes[path] = {
      nominal: nominal[path]!,
      min: e.min?.value ?? null,
      max: e.max?.value ?? null,
      minAt: e.min ? atOf(e.min.ends) : {},
      maxAt: e.max ? atOf(e.max.ends) : {},
    };
  });
  return {
    method: exhaustive ? 'exhaustive' : 'sensitivity-search',
    evaluated: cache.size,
    failed,
    failures,
    parameters: varied.map((i) => ({
      id: ev.parameters[i]!.id,
      low: ev.parameters[i]!.low,
      high: ev.parameters[i]!.high,
    })),
    probes,
  };
}

/** For each probed result its lowest and highest value over the tolerance corners, and where. */
export function runCorners(input: CornersInput): CornersResult {
  const { exhaustiveLimit } = parseInput(
    optionsSchema,
    { exhaustiveLimit: input.exhaustiveLimit },
    'corners',
  );
  if (input.probes.length === 0)
    throw new EngineError('bad-option', 'corners: give at least one result path to probe');
  return cornersWith(createEvaluator(input), exhaustiveLimit);
}
