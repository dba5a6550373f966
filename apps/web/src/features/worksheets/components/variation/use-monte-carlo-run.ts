import type { MonteCarloResult, WorksheetDraft } from '@biasproof/calc';
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
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
  state: MonteCarloRunState;
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
  const runner = useRef<MonteCarloRunner | null>(null);
  /** The run whose news is shown; answers of a run that was replaced are ignored. */
  const current = useRef<{ handle: MonteCarloHandle | null } | null>(null);
  const [state, setState] = useState<MonteCarloRunState>({ status: 'idle' });

  useEffect(
    () => () => {
      current.current = null;
      runner.current?.dispose();
      runner.current = null;
    },
    [],
  );

  const start = useCallback<MonteCarloRun['start']>(
    (request, key, onComplete) => {
      current.current?.handle?.cancel();
      runner.current ??= createRunner();
      setState({ status: 'running', done: 0, total: request.samples, failed: 0 });
      // The engine may report its first chunk before run() returns: the run is current already.
      const run: { handle: MonteCarloHandle | null } = { handle: null };
      current.current = run;
      const handle = runner.current.run(request, (p) => {
        if (current.current === run)
          setState({ status: 'running', done: p.done, total: p.total, failed: p.failed });
      });
      run.handle = handle;
      handle.result.then(
        (result) => {
          if (current.current !== run) return;
          current.current = null;
          if (result.status === 'cancelled') {
            setState({ status: 'cancelled', done: result.samples, total: result.requested });
            return;
          }
          const belongs = onComplete(result, latestDraft.current);
          setState(belongs ? { status: 'complete', key, result } : { status: 'stale' });
        },
        (error: unknown) => {
          if (current.current !== run) return;
          current.current = null;
          setState({
            status: 'failed',
            message: error instanceof Error ? error.message : String(error),
          });
        },
      );
    },
    [createRunner],
  );

  const cancel = useCallback(() => current.current?.handle?.cancel(), []);
  return useMemo(() => ({ state, start, cancel }), [state, start, cancel]);
}
