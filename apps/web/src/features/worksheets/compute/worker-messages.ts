import type { WorksheetDraft, WorksheetResults } from '@biasproof/calc';

/** Messages between the page and the compute worker. */
export interface ComputeRequest {
  id: number;
  draft: WorksheetDraft;
}

export interface ComputeResponse {
  id: number;
  answer: ComputeAnswer;
}

/** Results with the time the engine took (kept apart: stored results carry no timings). */
export interface ComputeAnswer {
  result: WorksheetResults;
  /** ms */
  elapsedMs: number;
}

/** Runs the engine and times it. */
export function timed(
  compute: (draft: WorksheetDraft) => WorksheetResults,
  draft: WorksheetDraft,
): ComputeAnswer {
  const started = performance.now();
  const result = compute(draft);
  return { result, elapsedMs: performance.now() - started };
}
