import { isGround, type WorksheetDraft } from '@biasproof/calc';
import { useCallback, useMemo, useState, type ReactNode } from 'react';
import { Card } from '@/components/ui/card.tsx';
import {
  CircuitEditor,
  type PendingElement,
} from '@/features/worksheets/components/editor/circuit-editor.tsx';
import { DeckTools } from '@/features/worksheets/components/editor/deck-tools.tsx';
import { HistoryBar } from '@/features/worksheets/components/editor/history-bar.tsx';
import { ModelsSection } from '@/features/worksheets/components/editor/models-section.tsx';
import { SettingsPanel } from '@/features/worksheets/components/editor/settings-panel.tsx';
import { ResultsPanel } from '@/features/worksheets/components/results/results-panel.tsx';
import { applyEdit } from '@/features/worksheets/draft/draft-edits.ts';
import { useDraftHistory } from '@/features/worksheets/hooks/use-draft-history.ts';
import { useLiveResults } from '@/features/worksheets/hooks/use-live-results.ts';

function Panel({ title, children }: { title: string; children: ReactNode }) {
  const id = `ws-${title.toLowerCase().replace(/[^a-z]+/g, '-')}`;
  return (
    <Card aria-labelledby={id} className="!p-5">
      <h2 id={id} className="mb-4 text-lg font-bold text-ink-900">
        {title}
      </h2>
      {children}
    </Card>
  );
}

/** The draft with an element being typed put in, so that results follow the typing. */
function withPending(draft: WorksheetDraft, pending: PendingElement | null): WorksheetDraft {
  if (!pending) return draft;
  return pending.index === null
    ? applyEdit(draft, { type: 'add-element', element: pending.element })
    : applyEdit(draft, { type: 'update-element', index: pending.index, element: pending.element });
}

function focusElementRow(name: string) {
  // Element names hold letters, digits, _ and . only: safe inside a quoted attribute selector.
  document.querySelector<HTMLElement>(`[data-element="${name.toLowerCase()}"] button`)?.focus();
}

/**
 * The author's worksheet: circuit editor and settings on one side, results computed as they type
 * on the other. Runs on the engine in the browser; `initialDraft` is where the session starts.
 */
export function WorksheetWorkspace({
  initialDraft,
  heading,
}: {
  initialDraft: () => WorksheetDraft;
  /** The page's heading, given the current draft. */
  heading: (draft: WorksheetDraft) => ReactNode;
}) {
  const history = useDraftHistory(initialDraft);
  const { draft, edit } = history;
  const [pending, setPending] = useState<PendingElement | null>(null);
  const preview = useMemo(() => withPending(draft, pending), [draft, pending]);
  const live = useLiveResults(preview);
  const onPending = useCallback((p: PendingElement | null) => setPending(p), []);

  const flagged = useMemo(() => {
    const names = new Set<string>();
    const result = live.result;
    if (result?.status !== 'failed') return names;
    const { element, node } = result.error;
    if (element) names.add(element.toLowerCase());
    else if (node && !isGround(node)) {
      for (const el of draft.circuit.elements) {
        if (el.nodes.some((n) => n.toLowerCase() === node)) names.add(el.name.toLowerCase());
      }
    }
    return names;
  }, [live.result, draft.circuit.elements]);

  const pendingNote = pending
    ? pending.index === null
      ? `Includes ${pending.element.name}, not added to the circuit yet.`
      : `Includes unsaved changes to ${draft.circuit.elements[pending.index]?.name ?? pending.element.name}.`
    : null;

  return (
    <div className="mx-auto flex w-full max-w-[96rem] flex-col gap-6">
      <div className="flex flex-wrap items-end justify-between gap-4">
        {heading(draft)}
        <HistoryBar history={history} />
      </div>
      <div className="grid items-start gap-6 xl:grid-cols-[minmax(0,5fr)_minmax(0,6fr)]">
        <div className="flex min-w-0 flex-col gap-6">
          <Panel title="Circuit">
            <CircuitEditor
              circuit={draft.circuit}
              edit={edit}
              flagged={flagged}
              onPending={onPending}
            />
          </Panel>
          <Panel title="Models">
            <ModelsSection circuit={draft.circuit} edit={edit} />
          </Panel>
          <Panel title="Analysis settings">
            <SettingsPanel circuit={draft.circuit} settings={draft.settings} edit={edit} />
          </Panel>
          <Panel title="SPICE deck">
            <DeckTools draft={draft} edit={edit} />
          </Panel>
        </div>
        <div className="min-w-0 xl:sticky xl:top-4">
          <Panel title="Results">
            <ResultsPanel
              live={live}
              origin="local-preview"
              pendingNote={pendingNote}
              onGoToElement={focusElementRow}
            />
          </Panel>
        </div>
      </div>
    </div>
  );
}
