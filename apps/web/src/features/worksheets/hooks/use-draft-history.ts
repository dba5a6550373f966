import { useCallback, useEffect, useMemo, useReducer } from 'react';
import type { DraftEdit } from '@/features/worksheets/draft/draft-edits.ts';
import {
  historyLabels,
  historyReducer,
  startHistory,
} from '@/features/worksheets/draft/draft-history.ts';
import type { WorksheetDraft } from '@biasproof/calc';

export interface DraftHistoryApi {
  draft: WorksheetDraft;
  edit: (edit: DraftEdit, coalesce?: string) => void;
  undo: () => void;
  redo: () => void;
  /** What undo / redo would do, or null when there is nothing to do. */
  undoLabel: string | null;
  redoLabel: string | null;
}

/** Fields where Ctrl+Z belongs to the text being typed, not to the worksheet. */
function isTextEntry(target: EventTarget | null): boolean {
  if (!(target instanceof HTMLElement)) return false;
  if (target.isContentEditable || target instanceof HTMLTextAreaElement) return true;
  if (!(target instanceof HTMLInputElement)) return false;
  return !['button', 'checkbox', 'radio', 'file', 'submit', 'reset'].includes(target.type);
}

/**
 * The draft with undo and redo over this session's edits; Ctrl+Z undoes, Ctrl+Shift+Z and
 * Ctrl+Y redo (⌘ on a Mac) anywhere on the page except inside a text field.
 */
export function useDraftHistory(initial: () => WorksheetDraft): DraftHistoryApi {
  const [state, dispatch] = useReducer(historyReducer, undefined, () => startHistory(initial()));
  const edit = useCallback(
    (e: DraftEdit, coalesce?: string) =>
      dispatch(
        coalesce === undefined ? { type: 'edit', edit: e } : { type: 'edit', edit: e, coalesce },
      ),
    [],
  );
  const undo = useCallback(() => dispatch({ type: 'undo' }), []);
  const redo = useCallback(() => dispatch({ type: 'redo' }), []);

  useEffect(() => {
    function onKeyDown(event: KeyboardEvent) {
      if (!(event.ctrlKey || event.metaKey) || event.altKey || isTextEntry(event.target)) return;
      const key = event.key.toLowerCase();
      if (key === 'z' && !event.shiftKey) dispatch({ type: 'undo' });
      else if ((key === 'z' && event.shiftKey) || key === 'y') dispatch({ type: 'redo' });
      else return;
      event.preventDefault();
    }
    document.addEventListener('keydown', onKeyDown);
    return () => document.removeEventListener('keydown', onKeyDown);
  }, []);

  const labels = historyLabels(state);
  return useMemo(
    () => ({
      draft: state.present,
      edit,
      undo,
      redo,
      undoLabel: labels.undo,
      redoLabel: labels.redo,
    }),
    [state.present, edit, undo, redo, labels.undo, labels.redo],
  );
}
