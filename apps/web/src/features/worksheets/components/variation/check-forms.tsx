import { zodResolver } from '@hookform/resolvers/zod';
import type { HandCheck, Limit } from '@biasproof/calc';
import { useEffect, useId, type KeyboardEvent, type ReactNode } from 'react';
import { useForm } from 'react-hook-form';
import { Button } from '@/components/ui/button.tsx';
import { TextField } from '@/components/ui/text-field.tsx';
import {
  handCheckFormSchema,
  handCheckFormValues,
  limitFormSchema,
  limitFormValues,
  type HandCheckFormValues,
  type LimitFormValues,
} from '@/features/worksheets/components/variation/check-form-schemas.ts';
import { unitOfPath } from '@/features/worksheets/components/variation/variation-targets.ts';

function FormFrame({
  title,
  onCancel,
  children,
}: {
  title: string;
  onCancel: () => void;
  children: ReactNode;
}) {
  const id = useId();
  function onKeyDown(event: KeyboardEvent<HTMLDivElement>) {
    if (event.key !== 'Escape') return;
    event.preventDefault();
    onCancel();
  }
  return (
    <div
      role="region"
      aria-labelledby={`${id}-title`}
      onKeyDown={onKeyDown}
      className="flex flex-col gap-3 rounded-lg border-2 border-accent bg-surface p-4"
    >
      <h4 id={`${id}-title`} className="text-sm font-bold text-ink-900">
        {title}
      </h4>
      {children}
    </div>
  );
}

function Actions({ submitLabel, onCancel }: { submitLabel: string; onCancel: () => void }) {
  return (
    <div className="flex justify-end gap-2">
      <Button variant="outline" onClick={onCancel}>
        Cancel
      </Button>
      <Button type="submit">{submitLabel}</Button>
    </div>
  );
}

/** A limit on one result path: min and/or max, and the unit it is written in. */
export function LimitForm({
  title,
  initial,
  pathListId,
  onSave,
  onCancel,
}: {
  title: string;
  initial?: Limit | undefined;
  /** Id of the datalist of the worksheet's result paths. */
  pathListId: string;
  onSave: (limit: Limit) => void;
  onCancel: () => void;
}) {
  const {
    register,
    handleSubmit,
    watch,
    setValue,
    getFieldState,
    setFocus,
    formState: { errors },
  } = useForm<LimitFormValues, unknown, Limit>({
    resolver: zodResolver(limitFormSchema),
    defaultValues: limitFormValues(initial),
  });
  useEffect(() => setFocus('path'), [setFocus]);
  // The unit follows the path until the author writes one of their own.
  useEffect(() => {
    const subscription = watch((values, { name }) => {
      if (name === 'path' && !getFieldState('unit').isDirty)
        setValue('unit', unitOfPath(values.path ?? ''));
    });
    return () => subscription.unsubscribe();
  }, [watch, setValue, getFieldState]);

  return (
    <FormFrame title={title} onCancel={onCancel}>
      <form
        noValidate
        className="flex flex-col gap-3"
        onSubmit={(event) => void handleSubmit(onSave)(event)}
      >
        <div className="grid gap-3 sm:grid-cols-4">
          <TextField
            label="Result path"
            list={pathListId}
            autoComplete="off"
            spellCheck={false}
            error={errors.path?.message}
            className="sm:col-span-4"
            {...register('path')}
          />
          <TextField
            label="Min"
            autoComplete="off"
            error={errors.min?.message}
            {...register('min')}
          />
          <TextField
            label="Max"
            autoComplete="off"
            error={errors.max?.message}
            {...register('max')}
          />
          <TextField
            label="Unit"
            autoComplete="off"
            error={errors.unit?.message}
            {...register('unit')}
          />
        </div>
        <p className="text-xs text-ink-600">
          Leave min or max empty for a one-sided limit. Values in engineering notation (2.4, 4m5,
          10u).
        </p>
        <Actions submitLabel={initial ? 'Save limit' : 'Add limit'} onCancel={onCancel} />
      </form>
    </FormFrame>
  );
}

/** The author's hand-calculated value of a result and how far the engine may be from it. */
export function HandCheckForm({
  title,
  initial,
  pathListId,
  onSave,
  onCancel,
}: {
  title: string;
  initial?: HandCheck | undefined;
  pathListId: string;
  onSave: (check: HandCheck) => void;
  onCancel: () => void;
}) {
  const {
    register,
    handleSubmit,
    setFocus,
    formState: { errors },
  } = useForm<HandCheckFormValues, unknown, HandCheck>({
    resolver: zodResolver(handCheckFormSchema),
    defaultValues: handCheckFormValues(initial),
  });
  useEffect(() => setFocus('path'), [setFocus]);

  return (
    <FormFrame title={title} onCancel={onCancel}>
      <form
        noValidate
        className="flex flex-col gap-3"
        onSubmit={(event) => void handleSubmit(onSave)(event)}
      >
        <div className="grid gap-3 sm:grid-cols-2">
          <TextField
            label="Result path"
            list={pathListId}
            autoComplete="off"
            spellCheck={false}
            error={errors.path?.message}
            className="sm:col-span-2"
            {...register('path')}
          />
          <TextField
            label="Expected value"
            autoComplete="off"
            error={errors.expected?.message}
            {...register('expected')}
          />
          <TextField
            label="Tolerance (%)"
            autoComplete="off"
            error={errors.tolerance?.message}
            {...register('tolerance')}
          />
          <TextField
            label="Note"
            hint="The formula or assumption behind the value."
            autoComplete="off"
            error={errors.note?.message}
            className="sm:col-span-2"
            {...register('note')}
          />
        </div>
        <Actions submitLabel={initial ? 'Save check' : 'Add check'} onCancel={onCancel} />
      </form>
    </FormFrame>
  );
}
