import { zodResolver } from '@hookform/resolvers/zod';
import { modelKinds, type DeviceModel, type ModelKind } from '@biasproof/calc';
import { useEffect, useId, useMemo, type KeyboardEvent } from 'react';
import { useFieldArray, useForm, useWatch } from 'react-hook-form';
import { Button } from '@/components/ui/button.tsx';
import { TextField } from '@/components/ui/text-field.tsx';
import {
  modelFormSchema,
  type ModelFormValues,
} from '@/features/worksheets/components/editor/model-form-schema.ts';
import {
  modelKindLabels,
  parametersFor,
} from '@/features/worksheets/components/editor/model-parameters.ts';

interface ModelFormProps {
  title: string;
  initial: ModelFormValues;
  /** Names of the other models (a name must be unique). */
  otherNames: readonly string[];
  /** Kinds offered (an element's form offers only the kinds it can use). */
  kinds?: readonly ModelKind[];
  submitLabel: string;
  onSave: (model: DeviceModel) => void;
  onCancel: () => void;
}

/**
 * A device model: name, kind and SPICE parameters. A group rather than a form of its own, so it
 * can open inside an element's form; Enter saves the model, Escape closes it.
 */
export function ModelForm({
  title,
  initial,
  otherNames,
  kinds = modelKinds,
  submitLabel,
  onSave,
  onCancel,
}: ModelFormProps) {
  const id = useId();
  const schema = useMemo(() => modelFormSchema(otherNames), [otherNames]);
  const {
    register,
    control,
    handleSubmit,
    setFocus,
    formState: { errors },
  } = useForm<ModelFormValues, unknown, DeviceModel>({
    resolver: zodResolver(schema),
    defaultValues: initial,
    mode: 'onChange',
  });
  const params = useFieldArray({ control, name: 'params' });
  const kind = useWatch({ control, name: 'kind' });
  const suggestions = parametersFor(kind);

  useEffect(() => setFocus('name'), [setFocus]);

  const save = () => void handleSubmit(onSave)();
  function onKeyDown(event: KeyboardEvent<HTMLFieldSetElement>) {
    if (event.key === 'Escape') {
      event.preventDefault();
      event.stopPropagation();
      onCancel();
    } else if (event.key === 'Enter' && event.target instanceof HTMLInputElement) {
      event.preventDefault();
      save();
    }
  }

  return (
    <fieldset
      onKeyDown={onKeyDown}
      className="flex flex-col gap-3 rounded-md border border-accent bg-paper p-4"
    >
      <legend className="px-1 text-sm font-bold text-accent-strong">{title}</legend>
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField
          label="Model name"
          autoComplete="off"
          spellCheck={false}
          error={errors.name?.message}
          {...register('name')}
        />
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-kind`} className="text-sm font-semibold text-ink-700">
            Model kind
          </label>
          <select
            id={`${id}-kind`}
            className="rounded-md border border-ink-500 bg-surface px-3 py-2 text-ink-900"
            {...register('kind')}
          >
            {kinds.map((k) => (
              <option key={k} value={k}>
                {modelKindLabels[k]}
              </option>
            ))}
          </select>
        </div>
      </div>
      <datalist id={`${id}-params`}>
        {suggestions.map((p) => (
          <option key={p.name} value={p.name}>
            {p.meaning}
          </option>
        ))}
      </datalist>
      <ul className="flex flex-col gap-2" aria-label="Parameters">
        {params.fields.map((field, index) => {
          const meaning = suggestions.find((s) => s.name === field.name.toUpperCase())?.meaning;
          return (
            <li key={field.id} className="grid grid-cols-[1fr_1fr_auto] items-start gap-2">
              <TextField
                label={`Parameter ${index + 1} name`}
                list={`${id}-params`}
                autoComplete="off"
                spellCheck={false}
                className="font-mono"
                error={errors.params?.[index]?.name?.message}
                {...register(`params.${index}.name`)}
              />
              <TextField
                label={`Parameter ${index + 1} value`}
                autoComplete="off"
                spellCheck={false}
                hint={meaning}
                error={errors.params?.[index]?.value?.message}
                {...register(`params.${index}.value`)}
              />
              <Button
                size="sm"
                variant="quiet"
                className="mt-7"
                aria-label={`Remove parameter ${index + 1}`}
                onClick={() => params.remove(index)}
              >
                Remove
              </Button>
            </li>
          );
        })}
      </ul>
      <p className="text-xs text-ink-600">
        Parameters left out take the SPICE defaults. Suggestions for this kind:{' '}
        {suggestions.map((s) => s.name).join(', ')}.
      </p>
      <div className="flex flex-wrap gap-2">
        <Button size="sm" variant="outline" onClick={() => params.append({ name: '', value: '' })}>
          Add parameter
        </Button>
        <span className="flex-1" />
        <Button size="sm" variant="outline" onClick={onCancel}>
          Cancel
        </Button>
        <Button size="sm" onClick={save}>
          {submitLabel}
        </Button>
      </div>
    </fieldset>
  );
}
