import type { DeviceModel, DraftCircuit, Element, ElementKind } from '@biasproof/calc';
import { useCallback, useId, useMemo, useRef, useState } from 'react';
import { Button } from '@/components/ui/button.tsx';
import { TextField } from '@/components/ui/text-field.tsx';
import {
  elementFormValues,
  newElementFormValues,
  type ElementFormContext,
} from '@/features/worksheets/components/editor/element-form-schema.ts';
import { ElementForm } from '@/features/worksheets/components/editor/element-form.tsx';
import { elementKinds, kindSpecs } from '@/features/worksheets/components/editor/element-kinds.ts';
import { ElementTable } from '@/features/worksheets/components/editor/element-table.tsx';
import {
  circuitNodes,
  modelsFor,
  nextElementName,
} from '@/features/worksheets/draft/circuit-facts.ts';
import type { DraftEdit } from '@/features/worksheets/draft/draft-edits.ts';

/** An element being typed but not saved yet: results preview it. `index` null: a new element. */
export interface PendingElement {
  index: number | null;
  element: Element;
}

type OpenForm = { mode: 'add'; kind: ElementKind } | { mode: 'edit'; index: number } | null;

interface CircuitEditorProps {
  circuit: DraftCircuit;
  edit: (e: DraftEdit, coalesce?: string) => void;
  /** Lowercase names of elements the engine's error is about. */
  flagged: ReadonlySet<string>;
  onPending: (pending: PendingElement | null) => void;
  /** Shown only: no title editing, no forms, no buttons. */
  readOnly?: boolean;
}

/** The block's title, its elements (table + typed form) and the way to add more. */
export function CircuitEditor({
  circuit,
  edit,
  flagged,
  onPending,
  readOnly = false,
}: CircuitEditorProps) {
  const id = useId();
  const nodeListId = `${id}-nodes`;
  const [requested, setRequested] = useState<OpenForm>(null);
  const [newKind, setNewKind] = useState<ElementKind>('R');
  const addButton = useRef<HTMLButtonElement>(null);
  const { elements, models } = circuit;
  // Undo may remove the element being edited: then its form closes.
  const open = requested?.mode === 'edit' && !elements[requested.index] ? null : requested;
  const kind = open === null ? null : open.mode === 'add' ? open.kind : elements[open.index]!.kind;
  const editingIndex = open?.mode === 'edit' ? open.index : null;

  const context = useMemo<ElementFormContext | null>(() => {
    if (kind === null) return null;
    const otherNames = elements.filter((_, i) => i !== editingIndex).map((el) => el.name);
    return { kind, otherNames, models: modelsFor(circuit, kind) };
  }, [kind, elements, editingIndex, circuit]);

  const preview = useCallback(
    (element: Element) => onPending({ index: editingIndex, element }),
    [onPending, editingIndex],
  );

  function close(focusTarget?: string) {
    setRequested(null);
    onPending(null);
    // Back where the author was: the row just edited, or the add button.
    queueMicrotask(() => {
      const row = focusTarget
        ? document.querySelector<HTMLElement>(`[data-element="${focusTarget}"] button`)
        : null;
      (row ?? addButton.current)?.focus();
    });
  }

  function save(element: Element) {
    if (editingIndex === null) edit({ type: 'add-element', element });
    else edit({ type: 'update-element', index: editingIndex, element });
    close(element.name.toLowerCase());
  }

  const formTitle =
    open?.mode === 'edit'
      ? `Edit ${elements[open.index]!.name}`
      : kind
        ? `New ${kindSpecs[kind].label.toLowerCase()}`
        : '';
  const initial =
    open === null
      ? null
      : open.mode === 'edit'
        ? elementFormValues(elements[open.index]!)
        : newElementFormValues(
            open.kind,
            nextElementName(circuit, open.kind),
            modelsFor(circuit, open.kind)[0]?.name ?? '',
          );

  return (
    <div className="flex flex-col gap-4">
      <TextField
        label="Block title"
        value={circuit.title}
        maxLength={200}
        readOnly={readOnly}
        onChange={(e) => edit({ type: 'set-title', title: e.currentTarget.value }, 'title')}
      />
      <datalist id={nodeListId}>
        <option value="0">ground</option>
        {circuitNodes(circuit).map((n) => (
          <option key={n} value={n} />
        ))}
      </datalist>

      {elements.length === 0 ? (
        <p className="rounded-md border border-dashed border-ink-300 px-4 py-6 text-center text-sm text-ink-600">
          {readOnly
            ? 'The circuit is empty.'
            : 'The circuit is empty. Add a part below, or import a SPICE deck.'}
        </p>
      ) : (
        <ElementTable
          elements={elements}
          flagged={flagged}
          editing={editingIndex}
          readOnly={readOnly}
          onEdit={(index) => setRequested({ mode: 'edit', index })}
          onDuplicate={(index) => edit({ type: 'duplicate-element', index })}
          onDelete={(index) => {
            if (editingIndex !== null) close();
            edit({ type: 'delete-element', index });
          }}
        />
      )}

      {open && context && initial && !readOnly ? (
        <ElementForm
          key={open.mode === 'edit' ? `edit-${open.index}` : `add-${open.kind}`}
          title={formTitle}
          initial={initial}
          context={context}
          nodeListId={nodeListId}
          allModels={models}
          submitLabel={open.mode === 'edit' ? 'Save changes' : 'Add to circuit'}
          onSave={save}
          onCancel={() =>
            close(open.mode === 'edit' ? elements[open.index]?.name.toLowerCase() : undefined)
          }
          onPreview={preview}
          onCreateModel={(model: DeviceModel) => edit({ type: 'add-model', model })}
        />
      ) : null}

      {readOnly ? null : (
        <div className="flex flex-wrap items-end gap-2">
          <div className="flex flex-col gap-1">
            <label htmlFor={`${id}-kind`} className="text-sm font-semibold text-ink-700">
              Kind of part
            </label>
            <select
              id={`${id}-kind`}
              value={newKind}
              onChange={(e) => setNewKind(e.currentTarget.value as ElementKind)}
              className="rounded-md border border-ink-500 bg-surface px-3 py-2 text-ink-900"
            >
              {elementKinds.map((k) => (
                <option key={k} value={k}>
                  {kindSpecs[k].label} ({k})
                </option>
              ))}
            </select>
          </div>
          <Button
            ref={addButton}
            variant="outline"
            onClick={() => {
              onPending(null);
              setRequested({ mode: 'add', kind: newKind });
            }}
          >
            Add part
          </Button>
          {elements.length > 0 ? (
            <Button
              variant="quiet"
              onClick={() => {
                close();
                edit({ type: 'clear' });
              }}
            >
              Clear circuit
            </Button>
          ) : null}
        </div>
      )}
    </div>
  );
}
