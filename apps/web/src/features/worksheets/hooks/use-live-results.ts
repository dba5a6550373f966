import type { WorksheetDraft, WorksheetResults } from '@biasproof/calc';
import { useEffect, useRef, useState } from 'react';
import { useComputeFunction } from '@/features/worksheets/compute/compute-context.tsx';

/** Wait after a change before computing, so that a burst of keystrokes computes once. */
export const COMPUTE_DEBOUNCE_MS = 20;

export interface LiveResults {
  /** Results of the newest draft computed so far; null before the first answer. */
  result: WorksheetResults | null;
  /** The draft `result` belongs to. */
  computedDraft: WorksheetDraft | null;
  /** Time the engine took for `result`, ms. */
  elapsedMs: number | null;
  /** True while a newer draft than `computedDraft` is being computed. */
  computing: boolean;
}

type Shown = Omit<LiveResults, 'computing'>;

/**
 * Recomputes the results whenever the draft changes. Every request carries a sequence number;
 * an answer that arrives after a newer request was made is dropped, so the screen never shows
 * numbers of an older circuit than the one in the editor.
 */
export function useLiveResults(draft: WorksheetDraft): LiveResults {
  const compute = useComputeFunction();
  const sequence = useRef(0);
  const [shown, setShown] = useState<Shown>({ result: null, computedDraft: null, elapsedMs: null });

  useEffect(() => {
    const seq = ++sequence.current;
    const timer = setTimeout(() => {
      void compute(draft).then((answer) => {
        if (answer && seq === sequence.current) {
          setShown({ result: answer.result, computedDraft: draft, elapsedMs: answer.elapsedMs });
        }
      });
    }, COMPUTE_DEBOUNCE_MS);
    return () => clearTimeout(timer);
  }, [draft, compute]);

  return { ...shown, computing: shown.computedDraft !== draft };
}
