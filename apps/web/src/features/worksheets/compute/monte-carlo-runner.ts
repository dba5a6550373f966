import {
  runMonteCarloAsync,
  type MonteCarloProgress,
  type MonteCarloResult,
} from '@biasproof/calc';
import {
  monteCarloChunkSize,
  type MonteCarloFromWorker,
  type MonteCarloRequest,
  type MonteCarloToWorker,
} from '@/features/worksheets/compute/monte-carlo-messages.ts';

/** A run on its way: its result (complete or cancelled) and the way to stop it. */
export interface MonteCarloHandle {
  /** Resolves with the run's result (status `cancelled` after cancel); rejects with the engine's message. */
  result: Promise<MonteCarloResult>;
  cancel: () => void;
}

export interface MonteCarloRunner {
  run: (
    request: MonteCarloRequest,
    onProgress: (p: MonteCarloProgress) => void,
  ) => MonteCarloHandle;
  /** Stops the worker (a run still going is abandoned). */
  dispose: () => void;
}

/** Runs on the main thread between turns of the event loop (tests, browsers without workers). */
export function createInPageRunner(): MonteCarloRunner {
  return {
    run(request, onProgress) {
      let stop = false;
      const result = runMonteCarloAsync({
        ...request,
        chunkSize: monteCarloChunkSize(request.samples),
        onProgress,
        shouldCancel: () => stop,
      });
      return { result, cancel: () => (stop = true) };
    },
    dispose: () => undefined,
  };
}

/** Runs in a dedicated module worker, started on the first run and kept until dispose. */
export function createWorkerRunner(): MonteCarloRunner {
  let worker: Worker | null = null;
  let lastId = 0;
  const waiting = new Map<
    number,
    {
      onProgress: (p: MonteCarloProgress) => void;
      resolve: (r: MonteCarloResult) => void;
      reject: (e: Error) => void;
    }
  >();

  const start = (): Worker => {
    const w = new Worker(new URL('./monte-carlo.worker.ts', import.meta.url), { type: 'module' });
    w.addEventListener('message', (event: MessageEvent<MonteCarloFromWorker>) => {
      const message = event.data;
      const run = waiting.get(message.id);
      if (!run) return;
      if (message.type === 'progress') return run.onProgress(message.progress);
      waiting.delete(message.id);
      if (message.type === 'done') run.resolve(message.result);
      else run.reject(new Error(message.message));
    });
    w.addEventListener('error', () => {
      for (const run of waiting.values()) run.reject(new Error('The Monte Carlo worker stopped.'));
      waiting.clear();
      worker = null;
    });
    return w;
  };

  return {
    run(request, onProgress) {
      worker ??= start();
      const id = ++lastId;
      const running = worker;
      const result = new Promise<MonteCarloResult>((resolve, reject) =>
        waiting.set(id, { onProgress, resolve, reject }),
      );
      const send = (message: MonteCarloToWorker) => running.postMessage(message);
      send({ type: 'start', id, request });
      return { result, cancel: () => send({ type: 'cancel', id }) };
    },
    dispose() {
      worker?.terminate();
      worker = null;
      for (const run of waiting.values()) run.reject(new Error('The Monte Carlo run was stopped.'));
      waiting.clear();
    },
  };
}

/** The worker in a browser that has one, the page otherwise. */
export function defaultMonteCarloRunner(): MonteCarloRunner {
  return typeof Worker === 'undefined' ? createInPageRunner() : createWorkerRunner();
}
