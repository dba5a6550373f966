import { z } from 'zod';
import { limitSchema, parseInput, type Limit, type LimitInput } from './spec.ts';

/**
 * Limits on result paths: pass/fail with the margin to the nearer bound, at nominal and at the
 * worst corner; Monte Carlo yield against them is counted in monte-carlo.ts with
 * {@link withinLimit}.
 */

export interface LimitCheck {
  path: string;
  unit: string;
  min?: number;
  max?: number;
  /** The result checked; null when it could not be computed (failed solve, missing figure). */
  value: number | null;
  pass: boolean;
  /** Distance to the nearer bound, in `unit`: positive inside the limit, negative outside; null without a value. */
  margin: number | null;
  /** The margin in % of that bound's magnitude; null when the bound is 0 or there is no value. */
  marginPercent: number | null;
  /** The bound the margin is measured to. */
  bound: 'min' | 'max' | null;
}

/** True when `value` lies within the limit (bounds included). */
export function withinLimit(limit: Pick<Limit, 'min' | 'max'>, value: number): boolean {
  if (!Number.isFinite(value)) return false;
  return (
    (limit.min === undefined || value >= limit.min) &&
    (limit.max === undefined || value <= limit.max)
  );
}

/** One limit against one value. */
export function checkLimit(limit: Limit, value: number | null | undefined): LimitCheck {
  const base = {
    path: limit.path,
    unit: limit.unit,
    ...(limit.min === undefined ? {} : { min: limit.min }),
    ...(limit.max === undefined ? {} : { max: limit.max }),
  };
  if (value === null || value === undefined || !Number.isFinite(value))
    return { ...base, value: null, pass: false, margin: null, marginPercent: null, bound: null };
  const toMin = limit.min === undefined ? Infinity : value - limit.min;
  const toMax = limit.max === undefined ? Infinity : limit.max - value;
  const bound = toMin <= toMax ? 'min' : 'max';
  const margin = Math.min(toMin, toMax);
  const edge = bound === 'min' ? limit.min! : limit.max!;
  return {
    ...base,
    value,
    pass: withinLimit(limit, value),
    margin,
    marginPercent: edge === 0 ? null : (margin / Math.abs(edge)) * 100,
    bound,
  };
}

const limitsSchema = z.array(limitSchema).max(200, 'at most 200 limits');

/** Validates limits (EngineError `bad-option` on bad input) and fills their defaults. */
export function parseLimits(limits: readonly LimitInput[] | undefined): Limit[] {
  return parseInput(limitsSchema, limits ?? [], 'limits');
}

/**
 * Every limit against the values by result path (for example the nominal results, or a
 * worksheet's results resolved with resolveResultPath). A path without a value fails.
 */
export function checkLimits(
  values: Readonly<Record<string, number | null | undefined>>,
  limits: readonly LimitInput[],
): LimitCheck[] {
  return parseLimits(limits).map((limit) => checkLimit(limit, values[limit.path.trim()]));
}

/** The worse of a limit checked at a result's lowest and highest corner value. */
export function worstCornerCheck(
  limit: Limit,
  range: { min: number; max: number } | undefined,
): LimitCheck & { at: 'min' | 'max' | null } {
  if (!range) return { ...checkLimit(limit, null), at: null };
  const low = checkLimit(limit, range.min);
  const high = checkLimit(limit, range.max);
  return (low.margin ?? -Infinity) <= (high.margin ?? -Infinity)
    ? { ...low, at: 'min' }
    : { ...high, at: 'max' };
}

/** A limit at nominal, at its worst corner and as Monte Carlo yield, side by side. */
export interface LimitReport {
  nominal: LimitCheck;
  /** Null without a corners run (or when the result has no corner values). */
  worstCorner: (LimitCheck & { at: 'min' | 'max' | null }) | null;
  /** Fraction of the Monte Carlo samples within the limit; null without a run. */
  yield: number | null;
}

/** Every limit against the nominal values, the corners' ranges and the Monte Carlo yields by path. */
export function limitReport(
  limits: readonly LimitInput[],
  nominal: Readonly<Record<string, number | null | undefined>>,
  corners?: Readonly<Record<string, { min: number | null; max: number | null }>>,
  yields?: readonly { path: string; fraction: number }[],
): LimitReport[] {
  return parseLimits(limits).map((limit, i) => {
    const range = corners?.[limit.path];
    const usable =
      range && range.min !== null && range.max !== null
        ? { min: range.min, max: range.max }
        : undefined;
    return {
      nominal: checkLimit(limit, nominal[limit.path]),
      worstCorner: corners ? worstCornerCheck(limit, usable) : null,
      yield: yields?.[i]?.fraction ?? null,
    };
  });
}
