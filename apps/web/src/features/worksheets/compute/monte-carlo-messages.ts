import type {
  AnalysisSettings,
  DraftCircuit,
  LimitInput,
  VariedParameterInput,
} from '@biasproof/calc';
import type { MonteCarloProgress, MonteCarloResult } from '@biasproof/calc';

/** Messages between the page and the Monte Carlo worker (monte-carlo.worker.ts). */

/** One Monte Carlo run, as the worksheet's variation section describes it. */
export interface MonteCarloRequest {
  circuit: DraftCircuit;
  settings: AnalysisSettings;
  parameters: VariedParameterInput[];
  probes: string[];
  limits: LimitInput[];
  samples: number;
  seed: string | number;
}

export type MonteCarloToWorker =
  { type: 'start'; id: number; request: MonteCarloRequest } | { type: 'cancel'; id: number };

export type MonteCarloFromWorker =
  | { type: 'progress'; id: number; progress: MonteCarloProgress }
  | { type: 'done'; id: number; result: MonteCarloResult }
  | { type: 'error'; id: number; message: string };

/**
 * Samples between progress reports: about fifty reports a run. Each chunk ends with a turn of
 * the event loop (how a cancel message gets in), so much smaller chunks would cost more in turns
 * than they give in smoothness.
 */
export function monteCarloChunkSize(samples: number): number {
  return Math.max(10, Math.ceil(samples / 50));
}
