import type { MonteCarloResult, WorksheetDraft, WorksheetVariationResults } from '@biasproof/calc';
import type { MonteCarloRunState } from '@/features/worksheets/components/variation/use-monte-carlo-run.ts';
import {
  monteCarloKey,
  variationOf,
} from '@/features/worksheets/components/variation/variation-draft.ts';

export interface ShownMonteCarlo {
  result: MonteCarloResult;
  /** `run`: this browser's run of the current draft; `results`: the worksheet's computed (or stored) results. */
  origin: 'run' | 'results';
}

/**
 * The Monte Carlo result that belongs to the draft on screen: this session's run while the draft
 * is the one it recorded, otherwise the one in the worksheet's results (runs of up to 2000
 * samples, recomputed from the recorded seed), otherwise none.
 */
export function shownMonteCarlo(
  draft: WorksheetDraft,
  results: WorksheetVariationResults | undefined,
  state: MonteCarloRunState,
): ShownMonteCarlo | null {
  if (state.status === 'complete') {
    const recorded = variationOf(draft.settings).monteCarlo;
    if (state.key === monteCarloKey(draft, recorded))
      return { result: state.result, origin: 'run' };
  }
  if (results?.monteCarlo.ok) return { result: results.monteCarlo.value, origin: 'results' };
  return null;
}
