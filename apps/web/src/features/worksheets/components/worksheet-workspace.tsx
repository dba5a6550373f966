import {
  isGround,
  type DeviceModel,
  type WorksheetDraft,
  type WorksheetResults,
} from '@biasproof/calc';
import { useCallback, useEffect, useMemo, useState, type ReactNode } from 'react';
import { Card } from '@/components/ui/card.tsx';
import {
  CircuitEditor,
  type PendingElement,
} from '@/features/worksheets/components/editor/circuit-editor.tsx';
import { DeckTools } from '@/features/worksheets/components/editor/deck-tools.tsx';
import { HistoryBar } from '@/features/worksheets/components/editor/history-bar.tsx';
import { ModelsSection } from '@/features/worksheets/components/editor/models-section.tsx';
import { SettingsPanel } from '@/features/worksheets/components/editor/settings-panel.tsx';
import {
  ResultMarksProvider,
  type ResultMarks,
} from '@/features/worksheets/components/results/result-marks.tsx';
import {
  ResultsPanel,
  type StoredFrom,
} from '@/features/worksheets/components/results/results-panel.tsx';
import { draftKey } from '@/features/worksheets/draft/draft-key.ts';
import { applyEdit } from '@/features/worksheets/draft/draft-edits.ts';
import { useDraftHistory } from '@/features/worksheets/hooks/use-draft-history.ts';
import { useLiveResults, type LiveResults } from '@/features/worksheets/hooks/use-live-results.ts';

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

/** Results the server computed and stored for one draft (the saved revision). */
export interface StoredResults {
  /** draftKey() of the draft they belong to. */
  key: string;
  results: WorksheetResults;
  from: StoredFrom;
}

const ignoreEdit = () => undefined;
const noMarks: ResultMarks = {};

/**
 * The author's worksheet: circuit editor and settings on one side, results computed as they type
 * on the other. Runs on the engine in the browser; `initialDraft` is where the session starts.
 * While the draft is the one `stored` belongs to, the results shown are the stored ones.
 */
export function WorksheetWorkspace({
  initialDraft,
  heading,
  readOnly = false,
  stored,
  onDraftChange,
  library,
  sidePanel,
  resultMarks,
}: {
  initialDraft: () => WorksheetDraft;
  /** The page's heading, given the current draft. */
  heading: (draft: WorksheetDraft) => ReactNode;
  /** Shown only: no editing, no undo, no import (export stays). */
  readOnly?: boolean;
  stored?: StoredResults | undefined;
  /** Told after every change of the draft (not of an element still being typed). */
  onDraftChange?: (draft: WorksheetDraft) => void;
  /** The organization's model library, offered in the models panel. */
  library?: readonly DeviceModel[] | undefined;
  /** Shown beside the results (e.g. the review panel). */
  sidePanel?: ReactNode;
  /** Markers and activation laid over the result numbers. */
  resultMarks?: ResultMarks | undefined;
}) {
  const history = useDraftHistory(initialDraft);
  const draft = history.draft;
  const edit = readOnly ? ignoreEdit : history.edit;
  const [pending, setPending] = useState<PendingElement | null>(null);
  const preview = useMemo(() => withPending(draft, pending), [draft, pending]);
  const computed = useLiveResults(preview);
  const onPending = useCallback((p: PendingElement | null) => setPending(p), []);
  useEffect(() => onDraftChange?.(draft), [draft, onDraftChange]);

  const key = useMemo(() => (stored ? draftKey(draft) : null), [draft, stored]);
  const showStored = stored !== undefined && pending === null && key === stored.key;
  const live: LiveResults = showStored
    ? { result: stored.results, computedDraft: draft, elapsedMs: null, computing: false }
    : computed;

  const editing = useMemo(() => ({ draft, edit, readOnly }), [draft, edit, readOnly]);

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
        {readOnly ? null : <HistoryBar history={history} />}
      </div>
      <div className="grid items-start gap-6 xl:grid-cols-[minmax(0,5fr)_minmax(0,6fr)]">
        <div className="flex min-w-0 flex-col gap-6">
          <Panel title="Circuit">
            <CircuitEditor
              circuit={draft.circuit}
              edit={edit}
              flagged={flagged}
              onPending={onPending}
              readOnly={readOnly}
            />
          </Panel>
          <Panel title="Models">
            <ModelsSection
              circuit={draft.circuit}
              edit={edit}
              readOnly={readOnly}
              library={library}
            />
          </Panel>
          <Panel title="Analysis settings">
            <fieldset disabled={readOnly} className="min-w-0">
              <SettingsPanel circuit={draft.circuit} settings={draft.settings} edit={edit} />
            </fieldset>
          </Panel>
          <Panel title="SPICE deck">
            <DeckTools draft={draft} edit={edit} readOnly={readOnly} />
          </Panel>
        </div>
        {/* A side panel makes the column taller than the screen: then it scrolls with the page. */}
        <div className={`flex min-w-0 flex-col gap-6 ${sidePanel ? '' : 'xl:sticky xl:top-4'}`}>
          <Panel title="Results">
            <ResultMarksProvider marks={resultMarks ?? noMarks}>
              <ResultsPanel
                live={live}
                origin={showStored ? 'stored' : 'local-preview'}
                storedFrom={showStored ? stored.from : undefined}
                pendingNote={pendingNote}
                onGoToElement={focusElementRow}
                editing={editing}
              />
            </ResultMarksProvider>
          </Panel>
          {sidePanel}
        </div>
      </div>
    </div>
  );
}
