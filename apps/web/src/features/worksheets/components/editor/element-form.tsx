import { zodResolver } from '@hookform/resolvers/zod';
import type { DeviceModel, Element } from '@biasproof/calc';
import { useEffect, useId, useMemo, useState, type KeyboardEvent } from 'react';
import { useForm } from 'react-hook-form';
import { Button } from '@/components/ui/button.tsx';
import { TextField } from '@/components/ui/text-field.tsx';
import {
  elementFormSchema,
  readElementForm,
  type ElementFormContext,
  type ElementFormValues,
} from '@/features/worksheets/components/editor/element-form-schema.ts';
import { kindSpecs } from '@/features/worksheets/components/editor/element-kinds.ts';
import { ModelForm } from '@/features/worksheets/components/editor/model-form.tsx';
import { newModelFormValues } from '@/features/worksheets/components/editor/model-form-schema.ts';
import { modelKindLabels } from '@/features/worksheets/components/editor/model-parameters.ts';
import { modelKindsFor } from '@/features/worksheets/draft/circuit-facts.ts';

interface ElementFormProps {
  title: string;
  initial: ElementFormValues;
  context: ElementFormContext;
  /** Id of the datalist with the nodes already in the circuit. */
  nodeListId: string;
  /** Every model in the circuit (for unique names of new ones). */
  allModels: readonly DeviceModel[];
  submitLabel: string;
  onSave: (element: Element) => void;
  onCancel: () => void;
  /** Called with the element whenever the form holds a valid one, so results follow the typing. */
  onPreview: (element: Element) => void;
  onCreateModel: (model: DeviceModel) => void;
}

const selectClass = 'rounded-md border bg-surface px-3 py-2 text-ink-900';

/** A typed form for one element: its name, its terminals' nodes, its values or model. */
export function ElementForm(props: ElementFormProps) {
  const {
    title,
    initial,
    context,
    nodeListId,
    allModels,
    submitLabel,
    onSave,
    onCancel,
    onPreview,
    onCreateModel,
  } = props;
  const id = useId();
  const spec = kindSpecs[context.kind];
  const schema = useMemo(() => elementFormSchema(context), [context]);
  const [creatingModel, setCreatingModel] = useState(false);
  const [createdModel, setCreatedModel] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    watch,
    getValues,
    setValue,
    setFocus,
    formState: { errors },
  } = useForm<ElementFormValues, unknown, Element>({
    resolver: zodResolver(schema),
    defaultValues: initial,
    mode: 'onChange',
  });

  useEffect(() => setFocus(spec.nodeLabels.length > 0 ? 'nodes.0' : 'name'), [setFocus, spec]);

  useEffect(() => {
    const subscription = watch(() => {
      const read = readElementForm(getValues(), context);
      if ('element' in read) onPreview(read.element);
    });
    return () => subscription.unsubscribe();
  }, [watch, getValues, context, onPreview]);

  // A model made here is picked once it is among the options.
  useEffect(() => {
    if (!createdModel || !context.models.some((m) => m.name === createdModel)) return;
    setValue('model', createdModel, { shouldValidate: true });
    setFocus('model');
    setCreatedModel(null);
  }, [createdModel, context.models, setValue, setFocus]);

  function onKeyDown(event: KeyboardEvent<HTMLDivElement>) {
    if (event.key === 'Escape') {
      event.preventDefault();
      onCancel();
    }
  }

  const modelKinds = modelKindsFor(context.kind);
  const modelError = errors.model?.message;

  return (
    <div
      role="region"
      aria-labelledby={`${id}-title`}
      onKeyDown={onKeyDown}
      className="flex flex-col gap-4 rounded-lg border-2 border-accent bg-surface p-4"
    >
      <h3 id={`${id}-title`} className="text-base font-bold text-ink-900">
        {title}
      </h3>
      {spec.hint ? <p className="-mt-2 text-sm text-ink-600">{spec.hint}</p> : null}
      <form
        noValidate
        className="flex flex-col gap-4"
        onSubmit={(event) => void handleSubmit(onSave)(event)}
      >
        <div className="grid gap-3 sm:grid-cols-2">
          <TextField
            label="Name"
            autoComplete="off"
            spellCheck={false}
            error={errors.name?.message}
            {...register('name')}
          />
          {spec.nodeLabels.map((label, i) => (
            <TextField
              key={label}
              label={`${label} node`}
              list={nodeListId}
              autoComplete="off"
              spellCheck={false}
              error={errors.nodes?.[i]?.message}
              {...register(`nodes.${i}`)}
            />
          ))}
          {spec.usesModel ? (
            <div className="flex flex-col gap-1">
              <label htmlFor={`${id}-model`} className="text-sm font-semibold text-ink-700">
                Model
              </label>
              <div className="flex gap-2">
                <select
                  id={`${id}-model`}
                  aria-invalid={modelError ? true : undefined}
                  aria-describedby={modelError ? `${id}-model-error` : undefined}
                  className={`${selectClass} flex-1 ${modelError ? 'border-fault' : 'border-ink-500'}`}
                  {...register('model')}
                >
                  <option value="">Choose a model…</option>
                  {context.models.map((m) => (
                    <option key={m.name} value={m.name}>
                      {m.name} ({modelKindLabels[m.kind]})
                    </option>
                  ))}
                </select>
                <Button
                  size="sm"
                  variant="outline"
                  aria-expanded={creatingModel}
                  onClick={() => setCreatingModel((v) => !v)}
                >
                  New model
                </Button>
              </div>
              {modelError ? (
                <p id={`${id}-model-error`} className="text-sm font-semibold text-fault">
                  {modelError}
                </p>
              ) : null}
            </div>
          ) : null}
          {spec.fields.map((field) => (
            <TextField
              key={field.key}
              label={
                field.unit && field.unit !== '°' ? `${field.label} (${field.unit})` : field.label
              }
              autoComplete="off"
              spellCheck={false}
              placeholder={field.placeholder}
              hint={field.optional ? 'Optional.' : undefined}
              error={errors.values?.[field.key]?.message}
              {...register(`values.${field.key}`)}
            />
          ))}
        </div>
        <p className="text-xs text-ink-600">
          Values in engineering notation: 4k7, 4.7k, 10u, 2.2n, 1meg (m is milli, meg is mega).
        </p>
        <div className="flex justify-end gap-2">
          <Button variant="outline" onClick={onCancel}>
            Cancel
          </Button>
          <Button type="submit">{submitLabel}</Button>
        </div>
      </form>
      {creatingModel ? (
        <ModelForm
          title={`New model for ${getValues('name') || spec.label.toLowerCase()}`}
          initial={newModelFormValues(
            modelKinds[0] ?? 'D',
            suggestModelName(allModels, modelKinds[0] ?? 'D'),
          )}
          otherNames={allModels.map((m) => m.name)}
          kinds={modelKinds}
          submitLabel="Add model"
          onCancel={() => {
            setCreatingModel(false);
            setFocus('model');
          }}
          onSave={(model) => {
            onCreateModel(model);
            setCreatingModel(false);
            setCreatedModel(model.name);
          }}
        />
      ) : null}
    </div>
  );
}

function suggestModelName(models: readonly DeviceModel[], kind: string): string {
  const taken = new Set(models.map((m) => m.name.toLowerCase()));
  for (let i = 1; ; i++) {
    const name = `${kind}MOD${i}`;
    if (!taken.has(name.toLowerCase())) return name;
  }
}
