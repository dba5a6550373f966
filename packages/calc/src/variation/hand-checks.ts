import { z } from 'zod';
import { handCheckSchema, parseInput, type HandCheck, type HandCheckInput } from './spec.ts';

/**
 * An author's hand-calculated values beside the engine's: the deviation in % of the hand value
 * and whether it lies within the author's tolerance. A hand calculation that disagrees with the
 * solved circuit is either a wrong hand calculation or a wrong circuit, and a checker wants to
 * see which.
 */

export interface HandCheckResult {
  path: string;
  expected: number;
  /** The engine's value; null when the result could not be computed. */
  actual: number | null;
  /** (actual − expected)/|expected|, %; null without an actual value. */
  deviationPercent: number | null;
  tolerancePercent: number;
  pass: boolean;
  note: string;
}

const checksSchema = z.array(handCheckSchema).max(200, 'at most 200 hand checks');

/** Validates hand checks (EngineError `bad-option` on bad input) and fills their defaults. */
export function parseHandChecks(checks: readonly HandCheckInput[] | undefined): HandCheck[] {
  return parseInput(checksSchema, checks ?? [], 'hand checks');
}

/** Each hand check against the values by result path (a path without a value fails). */
export function handCalcChecks(
  values: Readonly<Record<string, number | null | undefined>>,
  checks: readonly HandCheckInput[],
): HandCheckResult[] {
  return parseHandChecks(checks).map((c) => {
    const actual = values[c.path.trim()];
    const base = {
      path: c.path,
      expected: c.expected,
      tolerancePercent: c.tolerancePercent,
      note: c.note,
    };
    if (actual === null || actual === undefined || !Number.isFinite(actual))
      return { ...base, actual: null, deviationPercent: null, pass: false };
    const deviationPercent = ((actual - c.expected) / Math.abs(c.expected)) * 100;
    return {
      ...base,
      actual,
      deviationPercent,
      pass: Math.abs(deviationPercent) <= c.tolerancePercent,
    };
  });
}
