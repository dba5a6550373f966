import { formatSpiceNumber, type DeviceModel, type DraftCircuit } from '@biasproof/calc';
import { useId, useState } from 'react';
import { Button } from '@/components/ui/button.tsx';
import { ErrorMessage } from '@/components/ui/message.tsx';
import { ModelForm } from '@/features/worksheets/components/editor/model-form.tsx';
import {
  modelFormValues,
  newModelFormValues,
} from '@/features/worksheets/components/editor/model-form-schema.ts';
import { modelKindLabels } from '@/features/worksheets/components/editor/model-parameters.ts';
import { modelUsers } from '@/features/worksheets/draft/circuit-facts.ts';
import type { DraftEdit } from '@/features/worksheets/draft/draft-edits.ts';

type Open = { mode: 'new' } | { mode: 'edit'; index: number } | null;

const head = 'px-2 py-2 text-left text-xs font-semibold uppercase tracking-wide text-ink-600';
const cell = 'px-2 py-2 align-top text-sm';

/** Models of the organization's library that the circuit does not hold yet, to copy in. */
function LibraryPicker({
  circuit,
  library,
  edit,
}: {
  circuit: DraftCircuit;
  library: readonly DeviceModel[];
  edit: (e: DraftEdit) => void;
}) {
  const id = useId();
  const offered = library.filter(
    (m) => !circuit.models.some((c) => c.name.toLowerCase() === m.name.toLowerCase()),
  );
  const [chosen, setChosen] = useState('');
  const model = offered.find((m) => m.name === chosen) ?? offered[0];
  if (!model) return null;
  return (
    <div className="flex flex-wrap items-end gap-2">
      <div className="flex flex-col gap-1">
        <label htmlFor={`${id}-library`} className="text-sm font-semibold text-ink-700">
          From the model library
        </label>
        <select
          id={`${id}-library`}
          value={model.name}
          onChange={(e) => setChosen(e.currentTarget.value)}
          className="rounded-md border border-ink-500 bg-surface px-3 py-1.5 text-sm text-ink-900"
        >
          {offered.map((m) => (
            <option key={m.name} value={m.name}>
              {m.name} ({modelKindLabels[m.kind]})
            </option>
          ))}
        </select>
      </div>
      <Button
        size="sm"
        variant="outline"
        onClick={() =>
          edit({ type: 'add-model', model: { ...model, params: { ...model.params } } })
        }
      >
        Use this model
      </Button>
    </div>
  );
}

/** The device models of this circuit: list, new, edit, delete (while no element uses it). */
export function ModelsSection({
  circuit,
  edit,
  readOnly = false,
  library = [],
}: {
  circuit: DraftCircuit;
  edit: (e: DraftEdit) => void;
  /** Shown only: no buttons. */
  readOnly?: boolean;
  /** The organization's model library, offered for copying into the circuit. */
  library?: readonly DeviceModel[];
}) {
  const [requested, setOpen] = useState<Open>(null);
  // An undo may take away the model being edited: then the form closes.
  const editing = requested?.mode === 'edit' ? circuit.models[requested.index] : undefined;
  const open = requested?.mode === 'edit' && !editing ? null : requested;
  const [problem, setProblem] = useState<string | null>(null);
  const names = (except?: number) =>
    circuit.models.filter((_, i) => i !== except).map((m) => m.name);

  function remove(index: number, model: DeviceModel) {
    const users = modelUsers(circuit, model.name);
    if (users.length > 0) {
      setProblem(
        `${model.name} is used by ${users.map((u) => u.name).join(', ')}; give those another model first.`,
      );
      return;
    }
    setProblem(null);
    edit({ type: 'delete-model', index });
  }

  return (
    <div className="flex flex-col gap-3">
      {problem ? <ErrorMessage>{problem}</ErrorMessage> : null}
      {circuit.models.length === 0 ? (
        <p className="text-sm text-ink-600">No models yet. Diodes and transistors each need one.</p>
      ) : (
        <div className="overflow-x-auto">
          <table className="w-full border-collapse">
            <caption className="sr-only">Device models ({circuit.models.length})</caption>
            <thead className="border-b border-rule">
              <tr>
                <th scope="col" className={head}>
                  Model
                </th>
                <th scope="col" className={head}>
                  Kind
                </th>
                <th scope="col" className={head}>
                  Parameters
                </th>
                <th scope="col" className={head}>
                  Used by
                </th>
                {readOnly ? null : (
                  <th scope="col" className={head}>
                    <span className="sr-only">Actions</span>
                  </th>
                )}
              </tr>
            </thead>
            <tbody>
              {circuit.models.map((model, index) => (
                <tr key={model.name} className="border-b border-rule last:border-b-0">
                  <th scope="row" className={`${cell} text-left font-semibold`}>
                    {model.name}
                  </th>
                  <td className={cell}>{modelKindLabels[model.kind]}</td>
                  <td className={`${cell} font-mono text-xs`}>
                    {Object.entries(model.params)
                      .map(([k, v]) => `${k}=${formatSpiceNumber(v)}`)
                      .join(' ') || 'SPICE defaults'}
                  </td>
                  <td className={cell}>
                    {modelUsers(circuit, model.name)
                      .map((u) => u.name)
                      .join(', ') || '—'}
                  </td>
                  {readOnly ? null : (
                    <td className={`${cell} whitespace-nowrap text-right`}>
                      <Button
                        size="sm"
                        variant="quiet"
                        aria-label={`Edit model ${model.name}`}
                        onClick={() => setOpen({ mode: 'edit', index })}
                      >
                        Edit
                      </Button>
                      <Button
                        size="sm"
                        variant="quiet"
                        aria-label={`Delete model ${model.name}`}
                        onClick={() => remove(index, model)}
                      >
                        Delete
                      </Button>
                    </td>
                  )}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      {readOnly ? null : open === null ? (
        <div className="flex flex-wrap items-end justify-between gap-4">
          <Button size="sm" variant="outline" onClick={() => setOpen({ mode: 'new' })}>
            New model
          </Button>
          <LibraryPicker circuit={circuit} library={library} edit={edit} />
        </div>
      ) : open.mode === 'new' ? (
        <ModelForm
          title="New model"
          initial={newModelFormValues('D', `DMOD${circuit.models.length + 1}`)}
          otherNames={names()}
          submitLabel="Add model"
          onCancel={() => setOpen(null)}
          onSave={(model) => {
            edit({ type: 'add-model', model });
            setOpen(null);
          }}
        />
      ) : editing ? (
        <ModelForm
          key={open.index}
          title={`Edit model ${editing.name}`}
          initial={modelFormValues(editing)}
          otherNames={names(open.index)}
          submitLabel="Save model"
          onCancel={() => setOpen(null)}
          onSave={(model) => {
            edit({ type: 'update-model', index: open.index, model });
            setOpen(null);
          }}
        />
      ) : null}
    </div>
  );
}
