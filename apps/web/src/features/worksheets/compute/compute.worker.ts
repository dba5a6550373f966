import { computeWorksheet } from '@biasproof/calc';
import {
  timed,
  type ComputeRequest,
  type ComputeResponse,
} from '@/features/worksheets/compute/worker-messages.ts';

/**
 * The engine off the main thread. Requests that queue up while a computation runs are stale the
 * moment a newer one arrives, so only the newest waiting request is computed.
 */

let waiting: ComputeRequest | null = null;
let scheduled = false;

function computeNewest() {
  scheduled = false;
  const request = waiting;
  waiting = null;
  if (!request) return;
  const response: ComputeResponse = {
    id: request.id,
    answer: timed(computeWorksheet, request.draft),
  };
  globalThis.postMessage(response);
}

globalThis.addEventListener('message', (event: MessageEvent<ComputeRequest>) => {
  waiting = event.data;
  if (scheduled) return;
  scheduled = true;
  // Let every message already queued arrive before computing, so the newest one wins.
  setTimeout(computeNewest, 0);
});
