import type { CircuitInput } from '../circuit.ts';
import { isEngineError } from '../errors.ts';
import { runCorners, type CornersResult } from './corners.ts';
import { createEvaluator } from './evaluator.ts';
import { handCalcChecks, type HandCheckResult } from './hand-checks.ts';
import { limitReport, type LimitReport } from './limits.ts';
import { runMonteCarlo, type MonteCarloResult } from './monte-carlo.ts';
import { parseResultPath, readResultPath, type ResultSource } from './result-path.ts';
import { rssWith, type RssResult } from './rss.ts';
import type { EvaluationSettingsInput } from './settings.ts';
import {
  standardValueSuggestions,
  type StandardSuggestionsResult,
} from './standard-suggestions.ts';
import { partStress, type PartStressResult } from './stress.ts';
import { runTemperatureSweep, type TemperatureSweepResult } from './temperature-sweep.ts';
import { STORED_MONTE_CARLO_SAMPLES, type WorksheetVariation } from './worksheet-spec.ts';

/**
 * The variation results a worksheet stores with its revision, computed by computeWorksheet from
 * the settings' variation section. Each part succeeds or fails on its own (an Outcome), as the
 * worksheet's other analyses do. Monte Carlo runs here only up to 2000 samples, so that the
 * server's recompute of a revision stays quick; a larger run is the browser's (variation view,
 * in a worker) and is reported here as not run.
 */

export type VariationOutcome<T> =
  | { ok: true; value: T }
  | { ok: false; error: { code: string; message: string } }
  | { ok: false; missing: string };

export interface WorksheetVariationResults {
  /** The paths followed: extra probes, then those of the limits and hand checks. */
  probes: string[];
  /** Each path's value in the worksheet's own results (null: no such figure). */
  nominal: Record<string, number | null>;
  limits: LimitReport[];
  handChecks: HandCheckResult[];
  stress: VariationOutcome<PartStressResult>;
  standardValues: VariationOutcome<StandardSuggestionsResult>;
  /** Sensitivities and the RSS estimate (RssResult holds both). */
  rss: VariationOutcome<RssResult>;
  corners: VariationOutcome<CornersResult>;
  temperatures: VariationOutcome<TemperatureSweepResult>;
  monteCarlo: VariationOutcome<MonteCarloResult>;
}

function attempt<T>(run: () => T): VariationOutcome<T> {
  try {
    return { ok: true, value: run() };
  } catch (e) {
    if (!isEngineError(e)) throw e;
    return { ok: false, error: { code: e.code, message: e.message } };
  }
}

const missing = (text: string): VariationOutcome<never> => ({ ok: false, missing: text });

/** Each path's value in the source; a malformed path or a missing figure gives null. */
function valuesIn(source: ResultSource, paths: readonly string[]): Record<string, number | null> {
  const out: Record<string, number | null> = {};
  for (const path of paths) {
    try {
      out[path] = readResultPath(source, parseResultPath(path)) ?? null;
    } catch {
      out[path] = null;
    }
  }
  return out;
}

export interface WorksheetVariationContext {
  circuit: CircuitInput;
  /** The worksheet's analysis settings. */
  settings: EvaluationSettingsInput;
  variation: WorksheetVariation;
  /** The worksheet's solved bias point and small-signal figures (when it has them). */
  source: ResultSource;
}

/** Every variation result of a worksheet, from its settings' variation section. */
export function computeVariation(ctx: WorksheetVariationContext): WorksheetVariationResults {
  const { circuit, settings, variation: v } = ctx;
  const probes = [
    ...new Set([...v.probes, ...v.limits.map((l) => l.path), ...v.handChecks.map((h) => h.path)]),
  ];
  const nominal = valuesIn(ctx.source, probes);
  const toleranced = v.parameters.length > 0 && probes.length > 0;
  const input = { circuit, settings, parameters: v.parameters, probes };
  const noParameters = missing(
    'Add toleranced parameters and a limit, hand check or result path to follow.',
  );

  const rss = toleranced ? attempt(() => rssWith(createEvaluator(input))) : noParameters;
  const corners = toleranced ? attempt(() => runCorners(input)) : noParameters;
  const temperatures =
    v.temperatures.length > 0 && probes.length > 0
      ? attempt(() => runTemperatureSweep({ ...input, temperatures: v.temperatures }))
      : missing('Add temperatures and a limit, hand check or result path to follow.');
  const { samples, seed } = v.monteCarlo;
  let monteCarlo: VariationOutcome<MonteCarloResult>;
  if (!toleranced || samples === 0)
    monteCarlo = missing('Choose a number of Monte Carlo samples and toleranced parameters.');
  else if (samples > STORED_MONTE_CARLO_SAMPLES)
    monteCarlo = missing(
      `Monte Carlo of ${samples} samples runs in the variation view; the stored results hold runs of up to ${STORED_MONTE_CARLO_SAMPLES}.`,
    );
  else monteCarlo = attempt(() => runMonteCarlo({ ...input, samples, seed, limits: v.limits }));

  const cornerRanges = corners.ok ? corners.value.probes : undefined;
  const yields = monteCarlo.ok ? monteCarlo.value.yield?.limits : undefined;
  return {
    probes,
    nominal,
    limits: limitReport(v.limits, nominal, cornerRanges, yields),
    handChecks: handCalcChecks(nominal, v.handChecks),
    stress: attempt(() =>
      partStress({
        circuit,
        bias: ctx.source.bias,
        ratings: v.ratings,
        policy: v.policy,
        ambient: v.ambient,
      }),
    ),
    standardValues:
      probes.length > 0
        ? attempt(() =>
            standardValueSuggestions({ circuit, settings, probes, series: v.standardSeries }),
          )
        : missing('Add a limit, hand check or result path to see what standard values change.'),
    rss,
    corners,
    temperatures,
    monteCarlo,
  };
}
