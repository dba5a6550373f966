import { zodResolver } from '@hookform/resolvers/zod';
import { E_SERIES_NAMES, type AnalysisSettings, type DraftCircuit } from '@biasproof/calc';
import { canonicalJson } from '@biasproof/shared';
import { useEffect, useMemo, useRef } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { TextField } from '@/components/ui/text-field.tsx';
import { ParameterTable } from '@/features/worksheets/components/variation/parameter-table.tsx';
import { RatingTable } from '@/features/worksheets/components/variation/rating-table.tsx';
import { setupFormSchema } from '@/features/worksheets/components/variation/setup-form-schema.ts';
import {
  sameSetup,
  setupFormValues,
  setupOf,
  type SetupFormValues,
  type SetupValues,
} from '@/features/worksheets/components/variation/setup-form-values.ts';
import {
  variationEdit,
  variationOf,
  type VariationEditing,
} from '@/features/worksheets/components/variation/variation-draft.ts';
import {
  ratableParts,
  variedTargets,
} from '@/features/worksheets/components/variation/variation-targets.ts';

function Section({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <fieldset className="flex min-w-0 flex-col gap-2">
      <legend className="mb-1 text-sm font-bold text-ink-900">{title}</legend>
      {children}
    </fieldset>
  );
}

/**
 * What varies and what is checked, as a table form. Like the analysis settings, every valid
 * change goes into the draft at once (so it is undoable and autosaved); a field with an error
 * keeps the last valid setup.
 */
export function VariationSetup({
  circuit,
  settings,
  edit,
  readOnly,
}: {
  circuit: DraftCircuit;
  settings: AnalysisSettings;
  edit: VariationEditing['edit'];
  readOnly: boolean;
}) {
  // Keyed by content, so that edits elsewhere in the settings (limits, a Monte Carlo run) leave
  // the form alone while the author is typing into it.
  const setupKey = canonicalJson(setupOf(variationOf(settings)));
  const setup = useMemo(() => JSON.parse(setupKey) as SetupValues, [setupKey]);
  const form = useForm<SetupFormValues, unknown, SetupValues>({
    resolver: zodResolver(setupFormSchema),
    defaultValues: setupFormValues(setup),
    mode: 'onChange',
  });
  const { register, watch, reset, getValues, control, formState } = form;
  const errors = formState.errors;
  const mode = useWatch({ control, name: 'temperatureMode' });

  const current = useRef(settings);
  useEffect(() => {
    current.current = settings;
  }, [settings]);

  // The setup changed elsewhere (undo, another tab): show it, unless the form already does.
  useEffect(() => {
    const shown = setupFormSchema.safeParse(getValues());
    if (!shown.success || !sameSetup(shown.data, setup)) reset(setupFormValues(setup));
  }, [setup, getValues, reset]);

  useEffect(() => {
    const subscription = watch((_, { name, type }) => {
      const parsed = setupFormSchema.safeParse(getValues());
      if (!parsed.success) return;
      const before = current.current;
      if (sameSetup(parsed.data, setupOf(variationOf(before)))) return;
      // Typing into one field is one undo step; adding or removing a row is a step of its own.
      const change = variationEdit(before, parsed.data);
      if (type === 'change' && name) edit(change, `variation.${name}`);
      else edit(change);
    });
    return () => subscription.unsubscribe();
  }, [watch, getValues, edit]);

  const targets = useMemo(() => variedTargets(circuit), [circuit]);
  const parts = useMemo(() => ratableParts(circuit), [circuit]);

  return (
    <form noValidate onSubmit={(e) => e.preventDefault()} aria-label="Variation setup">
      <fieldset disabled={readOnly} className="flex min-w-0 flex-col gap-5">
        <Section title="Varied parameters">
          <ParameterTable form={form} targets={targets} readOnly={readOnly} />
        </Section>

        <Section title="Temperatures">
          <div className="flex flex-wrap gap-x-5 gap-y-2">
            <label className="flex items-center gap-2 text-sm text-ink-900">
              <input
                type="radio"
                value="list"
                className="size-4 accent-accent"
                {...register('temperatureMode')}
              />
              List
            </label>
            <label className="flex items-center gap-2 text-sm text-ink-900">
              <input
                type="radio"
                value="range"
                className="size-4 accent-accent"
                {...register('temperatureMode')}
              />
              Range
            </label>
          </div>
          {mode === 'list' ? (
            <TextField
              label="Temperatures (°C)"
              hint="Separated by commas, e.g. -40, 27, 125. Empty: no sweep."
              autoComplete="off"
              error={errors.temperatureList?.message}
              {...register('temperatureList')}
            />
          ) : (
            <div className="grid gap-3 sm:grid-cols-3">
              <TextField
                label="From (°C)"
                autoComplete="off"
                error={errors.temperatureFrom?.message}
                {...register('temperatureFrom')}
              />
              <TextField
                label="To (°C)"
                autoComplete="off"
                error={errors.temperatureTo?.message}
                {...register('temperatureTo')}
              />
              <TextField
                label="Step (K)"
                autoComplete="off"
                error={errors.temperatureStep?.message}
                {...register('temperatureStep')}
              />
            </div>
          )}
        </Section>

        <Section title="Followed results">
          <TextField
            label="Other result paths"
            hint="Separated by commas, e.g. nodes.out, devices.q1.ic. The paths of limits and hand checks are followed anyway."
            autoComplete="off"
            spellCheck={false}
            error={errors.probes?.message}
            {...register('probes')}
          />
        </Section>

        <Section title="Part ratings">
          <RatingTable form={form} parts={parts} readOnly={readOnly} />
          <TextField
            label="Ambient for junction temperatures (°C)"
            hint="Empty: the circuit temperature."
            autoComplete="off"
            error={errors.ambient?.message}
            {...register('ambient')}
            className="sm:max-w-xs"
          />
        </Section>

        <Section title="Standard-value series">
          <div className="flex flex-wrap gap-x-5 gap-y-2">
            {E_SERIES_NAMES.map((s) => (
              <label key={s} className="flex items-center gap-2 text-sm text-ink-900">
                <input
                  type="checkbox"
                  value={s}
                  className="size-4 accent-accent"
                  {...register('series')}
                />
                {s}
              </label>
            ))}
          </div>
          {errors.series?.message ? (
            <p className="text-sm font-semibold text-fault">{errors.series.message}</p>
          ) : null}
        </Section>
      </fieldset>
    </form>
  );
}
