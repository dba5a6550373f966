import type { MonteCarloResult, WorksheetDraft } from '@biasproof/calc';
import { useEffect, useRef, useState, useSyncExternalStore, type RefObject } from 'react';
import type { MonteCarloRequest } from '@/features/worksheets/compute/monte-carlo-messages.ts';
import {
  defaultMonteCarloRunner,
  type MonteCarloHandle,
  type MonteCarloRunner,
} from '@/features/worksheets/compute/monte-carlo-runner.ts';

export type MonteCarloRunState =
  | { status: 'idle' }
  | { status: 'running'; done: number; total: number; failed: number }
  | { status: 'cancelled'; done: number; total: number }
  /** `key`: monteCarloKey() of the draft the run belongs to. */
  | { status: 'complete'; key: string; result: MonteCarloResult }
  /** Completed, but the draft changed while it ran: the result belongs to no draft on screen. */
  | { status: 'stale' }
  | { status: 'failed'; message: string };

export interface MonteCarloRun {
  /**
   * Starts a run (stopping one still going). `onComplete` gets the result and the draft as it is
   * when the run ends, even if the view that started the run has closed, and answers whether
   * the result still belongs to that draft.
   */
  start: (
    request: MonteCarloRequest,
    key: string,
    onComplete: (result: MonteCarloResult, draftNow: WorksheetDraft) => boolean,
  ) => void;
  cancel: () => void;
  subscribe: (listener: () => void) => () => void;
  getState: () => MonteCarloRunState;
}

/** The run as a small store: progress reaches only the components that read it. */
function createRunStore(
  createRunner: () => MonteCarloRunner,
  latestDraft: RefObject<WorksheetDraft>,
): MonteCarloRun & { dispose: () => void } {
  let state: MonteCarloRunState = { status: 'idle' };
  const listeners = new Set<() => void>();
  const set = (next: MonteCarloRunState) => {
    state = next;
    for (const listener of listeners) listener();
  };
  let runner: MonteCarloRunner | null = null;
  /** The run whose news is shown; answers of a run that was replaced are ignored. */
  let current: { handle: MonteCarloHandle | null } | null = null;

  return {
    getState: () => state,
    subscribe(listener) {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
    start(request, key, onComplete) {
      current?.handle?.cancel();
      runner ??= createRunner();
      set({ status: 'running', done: 0, total: request.samples, failed: 0 });
      // The engine may report its first chunk before run() returns: the run is current already.
      const run: { handle: MonteCarloHandle | null } = { handle: null };
      current = run;
      run.handle = runner.run(request, (p) => {
        if (current === run)
          set({ status: 'running', done: p.done, total: p.total, failed: p.failed });
      });
      run.handle.result.then(
        (result) => {
          if (current !== run) return;
          current = null;
          if (result.status === 'cancelled') {
            set({ status: 'cancelled', done: result.samples, total: result.requested });
            return;
          }
          const belongs = onComplete(result, latestDraft.current);
          set(belongs ? { status: 'complete', key, result } : { status: 'stale' });
        },
        (error: unknown) => {
          if (current !== run) return;
          current = null;
          set({
            status: 'failed',
            message: error instanceof Error ? error.message : String(error),
          });
        },
      );
    },
    cancel: () => current?.handle?.cancel(),
    dispose() {
      current = null;
      runner?.dispose();
      runner = null;
    },
  };
}

/**
 * The session's Monte Carlo run. It lives above the results tabs, so a run goes on (and its
 * result stays) while the author looks at another view.
 */
export function useMonteCarloRun(
  draft: WorksheetDraft,
  createRunner: () => MonteCarloRunner = defaultMonteCarloRunner,
): MonteCarloRun {
  const latestDraft = useRef(draft);
  useEffect(() => {
    latestDraft.current = draft;
  }, [draft]);
  const [store] = useState(() => createRunStore(createRunner, latestDraft));
  useEffect(() => () => store.dispose(), [store]);
  return store;
}

/** The run's state; re-renders the caller on each progress report. */
export function useMonteCarloState(run: MonteCarloRun): MonteCarloRunState {
  return useSyncExternalStore(run.subscribe, run.getState);
}
