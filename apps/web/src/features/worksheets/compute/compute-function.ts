import { computeWorksheet, type WorksheetDraft } from '@biasproof/calc';
import {
  timed,
  type ComputeAnswer,
  type ComputeRequest,
  type ComputeResponse,
} from '@/features/worksheets/compute/worker-messages.ts';

/**
 * How the page gets results for a draft. Resolves to null when a newer request overtook this one
 * (its answer would be stale).
 */
export type ComputeFunction = (draft: WorksheetDraft) => Promise<ComputeAnswer | null>;
export type { ComputeAnswer };

/** Computes on the main thread (tests, and browsers without module workers). */
export const computeInPage: ComputeFunction = (draft) =>
  Promise.resolve(timed(computeWorksheet, draft));

/** Computes in a dedicated module worker, started on first use and kept for the session. */
export function createWorkerCompute(): ComputeFunction {
  let worker: Worker | null = null;
  let lastId = 0;
  const pending = new Map<
    number,
    { draft: WorksheetDraft; resolve: (answer: ComputeAnswer | null) => void }
  >();

  const start = (): Worker => {
    const w = new Worker(new URL('./compute.worker.ts', import.meta.url), { type: 'module' });
    w.addEventListener('message', (event: MessageEvent<ComputeResponse>) => {
      const { id, answer } = event.data;
      for (const [waitingId, { resolve }] of pending) {
        // The worker skips requests a newer one overtook: settle those as stale.
        if (waitingId < id) resolve(null);
        else if (waitingId === id) resolve(answer);
        else continue;
        pending.delete(waitingId);
      }
    });
    w.addEventListener('error', () => {
      // A worker that cannot start (or crashed) must not leave the page without numbers:
      // answer what is waiting on the main thread, and try a fresh worker next time.
      for (const { draft, resolve } of pending.values()) void computeInPage(draft).then(resolve);
      pending.clear();
      worker = null;
    });
    return w;
  };

  return (draft) =>
    new Promise((resolve) => {
      worker ??= start();
      const id = ++lastId;
      pending.set(id, { draft, resolve });
      const request: ComputeRequest = { id, draft };
      worker.postMessage(request);
    });
}

let shared: ComputeFunction | null = null;

/** The worker in a browser that has one, the page otherwise. */
export function defaultCompute(): ComputeFunction {
  shared ??= typeof Worker === 'undefined' ? computeInPage : createWorkerCompute();
  return shared;
}
