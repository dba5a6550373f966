import { z } from 'zod';
import { prepareCircuit } from '../topology.ts';
import { createEvaluator, engineAttempt, probeRecord, type EvaluatorInput } from './evaluator.ts';
import { parseInput } from './spec.ts';
import {
  E_SERIES_NAMES,
  eSeriesSchema,
  nearestStandardValue,
  type ESeries,
  type StandardValue,
} from './standard-values.ts';

/**
 * For each resistor its nearest preferred value in each E series, and the probed results
 * recomputed with every resistor moved to its series' value at once (what the built board would
 * give with parts of that series).
 */

export interface StandardSuggestionsInput extends Omit<EvaluatorInput, 'parameters'> {
  probes: readonly string[];
  /** Series to suggest from. Default E12, E24, E48 and E96. */
  series?: readonly ESeries[] | undefined;
}

export interface ResistorSuggestion {
  element: string;
  /** The resistor's value in the circuit, Ω. */
  value: number;
  /** Nearest value per series. */
  suggestions: Partial<Record<ESeries, StandardValue>>;
}

export type RecomputedWithSeries =
  | {
      ok: true;
      /** Probe values with every resistor at this series' value. */
      values: Record<string, number>;
      /** Change from nominal, % (null where nominal is 0). */
      changePercent: Record<string, number | null>;
    }
  | { ok: false; error: { code: string; message: string } };

export interface StandardSuggestionsResult {
  /** Probe values with the circuit's own values. */
  nominal: Record<string, number>;
  resistors: ResistorSuggestion[];
  recomputed: Partial<Record<ESeries, RecomputedWithSeries>>;
}

const seriesListSchema = z
  .array(eSeriesSchema)
  .min(1)
  .default([...E_SERIES_NAMES]);

/** Nearest E-series values of every resistor and the results recomputed with them. */
export function standardValueSuggestions(
  input: StandardSuggestionsInput,
): StandardSuggestionsResult {
  const series = parseInput(seriesListSchema, input.series, 'series');
  const resistors = prepareCircuit(input.circuit).circuit.elements.filter((el) => el.kind === 'R');
  const ev = createEvaluator({ ...input, parameters: resistors.map((r) => ({ target: r.name })) });
  const nominal = probeRecord(ev.probes, ev.nominalResults);
  const rows: ResistorSuggestion[] = resistors.map((r) => ({
    element: r.name,
    value: r.value,
    suggestions: Object.fromEntries(series.map((s) => [s, nearestStandardValue(r.value, s)])),
  }));
  const recomputed: StandardSuggestionsResult['recomputed'] = {};
  for (const s of series) {
    const values = rows.map((row) => row.suggestions[s]!.value);
    const r = engineAttempt(() => ev.evaluate(values));
    if (!r.ok) {
      recomputed[s] = { ok: false, error: { code: r.error.code, message: r.error.message } };
      continue;
    }
    const got = probeRecord(ev.probes, r.value);
    const changePercent: Record<string, number | null> = {};
    for (const path of ev.probes) {
      const before = nominal[path]!;
      changePercent[path] = before === 0 ? null : ((got[path]! - before) / Math.abs(before)) * 100;
    }
    recomputed[s] = { ok: true, values: got, changePercent };
  }
  return { nominal, resistors: rows, recomputed };
}
