import {
  worksheetVariationSchema,
  type AnalysisSettings,
  type WorksheetDraft,
  type WorksheetVariation,
} from '@biasproof/calc';
import type { MonteCarloRequest } from '@/features/worksheets/compute/monte-carlo-messages.ts';
import type { DraftEdit } from '@/features/worksheets/draft/draft-edits.ts';
import { draftKey } from '@/features/worksheets/draft/draft-key.ts';

/**
 * The variation section of a draft's settings: read with its defaults, written back complete
 * (as the server stores it), so that a saved draft and the revision it becomes hash alike.
 */

/** What the variation views edit and where the edits go. */
export interface VariationEditing {
  /** The author's current draft (the setup is read from it). */
  draft: WorksheetDraft;
  /** The worksheet's undoable edit path; `coalesce` merges a run of keystrokes into one step. */
  edit: (e: DraftEdit, coalesce?: string) => void;
  readOnly: boolean;
}

export function variationOf(settings: AnalysisSettings): WorksheetVariation {
  return settings.variation ?? worksheetVariationSchema.parse({});
}

export function withVariation(
  settings: AnalysisSettings,
  change: Partial<WorksheetVariation>,
): AnalysisSettings {
  const variation = worksheetVariationSchema.parse({ ...variationOf(settings), ...change });
  return { ...settings, variation };
}

/** The settings edit that changes part of the variation section. */
export function variationEdit(
  settings: AnalysisSettings,
  change: Partial<WorksheetVariation>,
): DraftEdit {
  return { type: 'set-settings', settings: withVariation(settings, change) };
}

/** Result paths the analyses follow, in the engine's order: extra probes, then limits, then hand checks. */
export function followedPaths(v: WorksheetVariation): string[] {
  return [
    ...new Set([...v.probes, ...v.limits.map((l) => l.path), ...v.handChecks.map((h) => h.path)]),
  ];
}

export interface MonteCarloChoice {
  samples: number;
  seed: string | number;
}

/**
 * The key of the draft that records this run: a run's result belongs on screen while the draft
 * is exactly the one it was run for, with the run's samples and seed written into it.
 */
export function monteCarloKey(draft: WorksheetDraft, run: MonteCarloChoice): string {
  const settings = withVariation(draft.settings, {
    monteCarlo: { samples: run.samples, seed: run.seed },
  });
  return draftKey({ circuit: draft.circuit, settings });
}

/** The run the worker makes: the same input computeWorksheet gives the engine, so the numbers agree. */
export function monteCarloRequest(draft: WorksheetDraft, run: MonteCarloChoice): MonteCarloRequest {
  const v = variationOf(draft.settings);
  return {
    circuit: draft.circuit,
    settings: draft.settings,
    parameters: v.parameters,
    probes: followedPaths(v),
    limits: v.limits,
    samples: run.samples,
    seed: run.seed,
  };
}
