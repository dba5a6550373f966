import { runMonteCarloAsync } from '@biasproof/calc';
import {
  monteCarloChunkSize,
  type MonteCarloFromWorker,
  type MonteCarloToWorker,
} from '@/features/worksheets/compute/monte-carlo-messages.ts';

/**
 * Monte Carlo off the main thread. The engine yields between chunks, which lets a cancel
 * message arrive while a run goes on; the run then ends with the samples solved so far.
 */

const cancelled = new Set<number>();
const post = (message: MonteCarloFromWorker) => globalThis.postMessage(message);

globalThis.addEventListener('message', (event: MessageEvent<MonteCarloToWorker>) => {
  const message = event.data;
  if (message.type === 'cancel') {
    cancelled.add(message.id);
    return;
  }
  const { id, request } = message;
  runMonteCarloAsync({
    ...request,
    chunkSize: monteCarloChunkSize(request.samples),
    onProgress: (progress) => post({ type: 'progress', id, progress }),
    shouldCancel: () => cancelled.has(id),
  })
    .then((result) => post({ type: 'done', id, result }))
    .catch((error: unknown) =>
      post({ type: 'error', id, message: error instanceof Error ? error.message : String(error) }),
    )
    .finally(() => cancelled.delete(id));
});
