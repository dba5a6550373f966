import { useState } from 'react';
import { Tabs } from '@/components/ui/tabs.tsx';
import { BiasView } from '@/features/worksheets/components/results/bias-view.tsx';
import { EngineErrorNotice } from '@/features/worksheets/components/results/engine-error-notice.tsx';
import { LoadLineView } from '@/features/worksheets/components/results/load-line-view.tsx';
import { SignalSizeView } from '@/features/worksheets/components/results/signal-size-view.tsx';
import { SmallSignalView } from '@/features/worksheets/components/results/small-signal-view.tsx';
import { StoredCsvProvider } from '@/features/worksheets/components/results/stored-csv.tsx';
import { LimitsView } from '@/features/worksheets/components/variation/limits-view.tsx';
import { useMonteCarloRun } from '@/features/worksheets/components/variation/use-monte-carlo-run.ts';
import type { VariationEditing } from '@/features/worksheets/components/variation/variation-draft.ts';
import { VariationView } from '@/features/worksheets/components/variation/variation-view.tsx';
import { displayName, independentSources } from '@/features/worksheets/draft/circuit-facts.ts';
import { sameName } from '@biasproof/calc';
import type { LiveResults } from '@/features/worksheets/hooks/use-live-results.ts';

interface ResultsPanelProps {
  live: LiveResults;
  /** Where the numbers come from: this browser's engine (a draft) or the server's stored run. */
  origin: 'local-preview' | 'stored';
  /** Shown when the preview includes an element being typed but not saved. */
  pendingNote?: string | null;
  /** For stored results: the revision they belong to. */
  storedFrom?: StoredFrom | undefined;
  onGoToElement: (name: string) => void;
  /** The draft and its edit path, for the variation and limits views' forms. */
  editing: VariationEditing;
}

/** The revision stored results were computed for. */
export interface StoredFrom {
  letter: string;
  engineVersion: string;
  contentHash: string;
}

const views = [
  { id: 'bias', label: 'Bias point' },
  { id: 'small-signal', label: 'Small-signal' },
  { id: 'signal-size', label: 'Signal size' },
  { id: 'load-line', label: 'Load line' },
  { id: 'variation', label: 'Variation' },
  { id: 'limits', label: 'Limits and checks' },
] as const;

function OriginLine({
  live,
  origin,
  pendingNote,
  storedFrom,
}: Pick<ResultsPanelProps, 'live' | 'origin' | 'pendingNote' | 'storedFrom'>) {
  const elapsed = live.result && live.result.status !== 'empty' ? live.elapsedMs : null;
  return (
    <div className="flex flex-wrap items-center gap-x-3 gap-y-1 text-sm">
      <span
        className={`rounded-full px-3 py-0.5 font-semibold ${origin === 'stored' ? 'bg-ok-tint text-ok' : 'bg-accent-tint text-accent-strong'}`}
      >
        {origin === 'stored' ? 'Stored results' : 'Local preview'}
      </span>
      <span className="text-ink-600">
        {origin === 'stored'
          ? 'Computed by the server and stored with the revision.'
          : 'Computed in this browser from the draft; not stored.'}
      </span>
      {origin === 'stored' && storedFrom ? (
        <span className="text-ink-700" data-testid="stored-from">
          Revision <strong className="font-semibold">{storedFrom.letter}</strong> · engine{' '}
          {storedFrom.engineVersion} ·{' '}
          <span title={`SHA-256 ${storedFrom.contentHash}`}>
            hash <code className="font-mono text-xs">{storedFrom.contentHash.slice(0, 12)}</code>
          </span>
        </span>
      ) : null}
      <span role="status" className="text-ink-600">
        {live.computing
          ? 'Updating…'
          : elapsed !== null
            ? `Engine time ${elapsed.toFixed(1)} ms.`
            : ''}
      </span>
      {pendingNote ? (
        <span className="w-full text-xs font-semibold text-pending">{pendingNote}</span>
      ) : null}
    </div>
  );
}

export function ResultsPanel({
  live,
  origin,
  pendingNote,
  storedFrom,
  onGoToElement,
  editing,
}: ResultsPanelProps) {
  const [view, setView] = useState<string>('bias');
  // Above the tabs, so that a Monte Carlo run goes on while another view is open.
  const monteCarlo = useMonteCarloRun(editing.draft);
  const { result, computedDraft } = live;
  const circuit = computedDraft?.circuit;
  const show = (name: string) => (circuit ? displayName(circuit, name) : name);

  let body;
  if (!result || !computedDraft || !circuit) {
    body = <p className="text-sm text-ink-600">Solving…</p>;
  } else if (result.status === 'empty') {
    body = (
      <div className="rounded-md border border-dashed border-ink-300 px-6 py-10 text-center">
        <p className="font-semibold text-ink-900">Nothing to solve yet.</p>
        <p className="mt-1 text-sm text-ink-600">
          Give the circuit a source and at least one part to drive, or import a deck; the bias point
          appears here as soon as the circuit can be solved.
        </p>
      </div>
    );
  } else if (result.status === 'failed') {
    body = (
      <EngineErrorNotice
        title="The circuit cannot be solved"
        error={result.error}
        show={show}
        onGoToElement={onGoToElement}
      />
    );
  } else {
    const input = independentSources(circuit).find((s) =>
      sameName(s.name, computedDraft.settings.inputSource),
    );
    body = (
      <Tabs
        label="Results views"
        selected={view}
        onSelect={setView}
        tabs={views.map((v) => ({
          id: v.id,
          label: v.label,
          content: () =>
            v.id === 'bias' ? (
              <BiasView results={result} circuit={circuit} show={show} />
            ) : v.id === 'small-signal' ? (
              <SmallSignalView results={result} show={show} />
            ) : v.id === 'variation' ? (
              <VariationView
                results={result}
                editing={editing}
                monteCarlo={monteCarlo}
                show={show}
              />
            ) : v.id === 'limits' ? (
              <LimitsView results={result} editing={editing} monteCarlo={monteCarlo} />
            ) : v.id === 'signal-size' ? (
              <SignalSizeView results={result} show={show} unit={input?.kind === 'I' ? 'A' : 'V'} />
            ) : (
              <LoadLineView results={result} show={show} />
            ),
        }))}
      />
    );
  }

  return (
    <div className="flex flex-col gap-4">
      <OriginLine live={live} origin={origin} pendingNote={pendingNote} storedFrom={storedFrom} />
      <div aria-busy={live.computing}>
        <StoredCsvProvider letter={origin === 'stored' ? (storedFrom?.letter ?? null) : null}>
          {body}
        </StoredCsvProvider>
      </div>
      <p className="border-t border-rule pt-3 text-xs text-ink-600">
        <strong className="font-semibold text-ink-700">Caution:</strong> these results are
        engineering aids, not a substitute for qualified review. Circuits with hazardous voltages
        follow local codes and licensed engineering practice.
      </p>
    </div>
  );
}
