import {
  exportDeck,
  isEngineError,
  parseDeck,
  type DeckWarning,
  type WorksheetDraft,
} from '@biasproof/calc';
import { useId, useState, type ChangeEvent } from 'react';
import { Button } from '@/components/ui/button.tsx';
import { ErrorMessage, SuccessMessage } from '@/components/ui/message.tsx';
import type { DraftEdit } from '@/features/worksheets/draft/draft-edits.ts';

type Report =
  | { tone: 'error'; file: string; line?: number; token?: string; message: string }
  | { tone: 'ok'; file: string; elements: number; warnings: DeckWarning[] };

/** A file name from the block's title: `Diode bias network` → `diode-bias-network.cir`. */
function deckFileName(title: string): string {
  const slug = title
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-|-$/g, '');
  return `${slug || 'worksheet'}.cir`;
}

/**
 * SPICE decks in and out. An import that fails changes nothing and says which line is wrong;
 * one that succeeds replaces the circuit (undoable) and lists what the engine skipped.
 */
export function DeckTools({
  draft,
  edit,
  readOnly = false,
}: {
  draft: WorksheetDraft;
  edit: (e: DraftEdit) => void;
  /** Export only: the worksheet cannot be changed. */
  readOnly?: boolean;
}) {
  const id = useId();
  const [report, setReport] = useState<Report | null>(null);
  const [exportError, setExportError] = useState<string | null>(null);

  async function onFile(event: ChangeEvent<HTMLInputElement>) {
    const input = event.currentTarget;
    const file = input.files?.[0];
    if (!file) return;
    const text = await file.text();
    input.value = '';
    try {
      const deck = parseDeck(text);
      const { circuit, directives } = deck;
      edit({
        type: 'replace',
        reason: `import ${file.name}`,
        draft: {
          circuit: { title: circuit.title, elements: circuit.elements, models: circuit.models },
          settings: {
            ...draft.settings,
            temperature: directives.temperature ?? draft.settings.temperature,
            sweep: directives.ac ?? draft.settings.sweep,
          },
        },
      });
      setReport({
        tone: 'ok',
        file: file.name,
        elements: circuit.elements.length,
        warnings: deck.warnings,
      });
    } catch (e) {
      if (!isEngineError(e)) throw e;
      setReport({
        tone: 'error',
        file: file.name,
        message: e.message,
        line: e.details.line,
        token: e.details.token,
      });
    }
  }

  function download() {
    setExportError(null);
    const { settings, circuit } = draft;
    let deck: string;
    try {
      deck = exportDeck(circuit, {
        op: true,
        ac: settings.sweep,
        ...(settings.temperature === 27 ? {} : { temperature: settings.temperature }),
      });
    } catch (e) {
      setExportError(isEngineError(e) ? `The deck cannot be written: ${e.message}` : String(e));
      return;
    }
    const url = URL.createObjectURL(new Blob([deck], { type: 'text/plain' }));
    const link = document.createElement('a');
    link.href = url;
    link.download = deckFileName(circuit.title);
    link.click();
    setTimeout(() => URL.revokeObjectURL(url), 0);
  }

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end gap-4">
        {readOnly ? null : (
          <div className="flex flex-col gap-1">
            <label htmlFor={`${id}-file`} className="text-sm font-semibold text-ink-700">
              Import a SPICE deck (.cir, .sp, .net)
            </label>
            <input
              id={`${id}-file`}
              type="file"
              accept=".cir,.sp,.net,.spice,text/plain"
              onChange={(e) => void onFile(e)}
              className="text-sm text-ink-700 file:mr-3 file:rounded-md file:border file:border-ink-500 file:bg-surface file:px-3 file:py-1.5 file:font-semibold file:text-ink-900 hover:file:bg-paper focus-visible:outline-2 focus-visible:outline-accent"
            />
          </div>
        )}
        <Button variant="outline" onClick={download} disabled={draft.circuit.elements.length === 0}>
          Export deck
        </Button>
      </div>
      <p className="text-xs text-ink-600">
        {readOnly ? '' : 'Importing replaces the circuit (Undo brings it back). '}The exported deck
        holds .op and the sweep as .ac, and runs in SPICE-class simulators.
      </p>
      {exportError ? <ErrorMessage>{exportError}</ErrorMessage> : null}
      {report?.tone === 'error' ? (
        <div
          role="alert"
          className="rounded-md border border-fault bg-fault-tint px-3 py-2 text-sm text-fault"
        >
          <p className="font-semibold">{report.file} was not imported; the circuit is unchanged.</p>
          <ul className="mt-1 list-disc pl-5">
            <li>
              {report.line === undefined ? '' : `Line ${report.line}: `}
              {report.message.replace(/^line \d+: /, '')}
              {report.token ? ` (at “${report.token}”)` : ''}
            </li>
          </ul>
        </div>
      ) : null}
      {report?.tone === 'ok' ? (
        <div className="flex flex-col gap-2">
          <SuccessMessage>
            Imported {report.file}: {report.elements} element{report.elements === 1 ? '' : 's'}.
          </SuccessMessage>
          {report.warnings.length > 0 ? (
            <div className="rounded-md border border-pending bg-pending-tint px-3 py-2 text-sm text-pending">
              <p className="font-semibold">Skipped or assumed while reading the deck:</p>
              <ul className="mt-1 list-disc pl-5">
                {report.warnings.map((w, i) => (
                  <li key={i}>
                    Line {w.line}: {w.message} <code className="font-mono text-xs">{w.text}</code>
                  </li>
                ))}
              </ul>
            </div>
          ) : null}
        </div>
      ) : null}
    </div>
  );
}
