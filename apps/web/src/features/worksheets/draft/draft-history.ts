import {
  applyEdit,
  describeEdit,
  type DraftEdit,
} from '@/features/worksheets/draft/draft-edits.ts';
import type { WorksheetDraft } from '@biasproof/calc';

/**
 * Undo and redo over the edits of this session. Each step remembers the draft before it and what
 * the edit was called. Consecutive edits with the same `coalesce` key (typing into one settings
 * field) make one step, so one undo takes back the whole run of keystrokes.
 */

interface Step {
  draft: WorksheetDraft;
  /** The edit that leads from this step's draft to the next one. */
  label: string;
}

export interface DraftHistory {
  past: Step[];
  present: WorksheetDraft;
  future: Step[];
  /** Coalesce key of the last edit, while a run of same-key edits is open. */
  openRun: string | null;
}

export type HistoryAction =
  { type: 'edit'; edit: DraftEdit; coalesce?: string } | { type: 'undo' } | { type: 'redo' };

/** Steps kept; older ones are forgotten. */
export const HISTORY_LIMIT = 200;

export function startHistory(draft: WorksheetDraft): DraftHistory {
  return { past: [], present: draft, future: [], openRun: null };
}

export function historyReducer(state: DraftHistory, action: HistoryAction): DraftHistory {
  switch (action.type) {
    case 'edit': {
      const next = applyEdit(state.present, action.edit);
      if (next === state.present) return state;
      const coalesce = action.coalesce ?? null;
      if (coalesce !== null && coalesce === state.openRun && state.past.length > 0) {
        return { ...state, present: next, future: [] };
      }
      const step = { draft: state.present, label: describeEdit(state.present, action.edit) };
      return {
        past: [...state.past, step].slice(-HISTORY_LIMIT),
        present: next,
        future: [],
        openRun: coalesce,
      };
    }
    case 'undo': {
      const step = state.past.at(-1);
      if (!step) return state;
      return {
        past: state.past.slice(0, -1),
        present: step.draft,
        future: [{ draft: state.present, label: step.label }, ...state.future],
        openRun: null,
      };
    }
    case 'redo': {
      const [step, ...rest] = state.future;
      if (!step) return state;
      return {
        past: [...state.past, { draft: state.present, label: step.label }],
        present: step.draft,
        future: rest,
        openRun: null,
      };
    }
  }
}

/** What undo and redo would take back or bring back, for the buttons. */
export function historyLabels(state: DraftHistory): { undo: string | null; redo: string | null } {
  return { undo: state.past.at(-1)?.label ?? null, redo: state.future[0]?.label ?? null };
}
