import { Button } from '@/components/ui/button.tsx';
import type { DraftHistoryApi } from '@/features/worksheets/hooks/use-draft-history.ts';

/** Undo and redo of this session's edits, saying what each would do. */
export function HistoryBar({ history }: { history: DraftHistoryApi }) {
  const { undo, redo, undoLabel, redoLabel } = history;
  return (
    <div className="flex items-center gap-2" role="group" aria-label="Edit history">
      <Button
        size="sm"
        variant="outline"
        onClick={undo}
        disabled={undoLabel === null}
        aria-keyshortcuts="Control+Z"
        title={undoLabel ? `Undo: ${undoLabel} (Ctrl+Z)` : 'Nothing to undo'}
      >
        Undo
      </Button>
      <Button
        size="sm"
        variant="outline"
        onClick={redo}
        disabled={redoLabel === null}
        aria-keyshortcuts="Control+Shift+Z Control+Y"
        title={redoLabel ? `Redo: ${redoLabel} (Ctrl+Shift+Z or Ctrl+Y)` : 'Nothing to redo'}
      >
        Redo
      </Button>
      <span className="text-xs text-ink-600" aria-live="polite">
        {undoLabel ? `Last edit: ${undoLabel}` : 'No edits yet'}
      </span>
    </div>
  );
}
