import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useId, useRef, type ReactNode } from 'react';
import { useForm, type UseFormRegisterReturn } from 'react-hook-form';
import { TextField } from '@/components/ui/text-field.tsx';
import {
  sameSettings,
  settingsFormSchema,
  settingsFormValues,
  type SettingsFormValues,
} from '@/features/worksheets/components/editor/settings-form-schema.ts';
import { circuitNodes, independentSources } from '@/features/worksheets/draft/circuit-facts.ts';
import type { DraftEdit } from '@/features/worksheets/draft/draft-edits.ts';
import {
  diodeLawLabels,
  diodeLaws,
  type AnalysisSettings,
  type DraftCircuit,
} from '@biasproof/calc';

interface SettingsPanelProps {
  circuit: DraftCircuit;
  settings: AnalysisSettings;
  /** `coalesce` groups a run of edits to one field into one undo step. */
  edit: (e: DraftEdit, coalesce?: string) => void;
}

function Select({
  label,
  children,
  registration,
}: {
  label: string;
  children: ReactNode;
  registration: UseFormRegisterReturn;
}) {
  const id = useId();
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-semibold text-ink-700">
        {label}
      </label>
      <select
        id={id}
        className="rounded-md border border-ink-500 bg-surface px-3 py-2 text-ink-900"
        {...registration}
      >
        {children}
      </select>
    </div>
  );
}

/**
 * Diode law, temperature, input and output, sweep and signal figures. Every valid change
 * applies at once (the results follow); a field with an error keeps the last valid value.
 */
export function SettingsPanel({ circuit, settings, edit }: SettingsPanelProps) {
  const {
    register,
    watch,
    reset,
    getValues,
    formState: { errors },
  } = useForm<SettingsFormValues, unknown, AnalysisSettings>({
    resolver: zodResolver(settingsFormSchema),
    defaultValues: settingsFormValues(settings),
    mode: 'onChange',
  });

  const current = useRef(settings);
  useEffect(() => {
    current.current = settings;
  }, [settings]);

  // Settings changed elsewhere (undo, import): show them, unless the panel already does.
  useEffect(() => {
    const shown = settingsFormSchema.safeParse(getValues());
    if (!shown.success || !sameSettings(shown.data, settings)) reset(settingsFormValues(settings));
  }, [settings, getValues, reset]);

  useEffect(() => {
    const subscription = watch((_, { name }) => {
      const parsed = settingsFormSchema.safeParse(getValues());
      if (!parsed.success || sameSettings(parsed.data, current.current)) return;
      // The panel's fields do not hold the variation section (its own view edits it): keep it.
      const { variation } = current.current;
      const settings = variation ? { ...parsed.data, variation } : parsed.data;
      edit({ type: 'set-settings', settings }, `settings.${name ?? 'all'}`);
    });
    return () => subscription.unsubscribe();
  }, [watch, getValues, edit]);

  const sources = independentSources(circuit);
  const nodes = circuitNodes(circuit);
  const input = sources.find((s) => s.name === settings.inputSource);
  const amplitudeUnit = input?.kind === 'I' ? 'A' : 'V';
  const text = (key: keyof SettingsFormValues, label: string, hint?: string) => (
    <TextField
      label={label}
      autoComplete="off"
      spellCheck={false}
      hint={hint}
      error={errors[key]?.message}
      {...register(key)}
    />
  );

  return (
    <form noValidate onSubmit={(e) => e.preventDefault()} className="flex flex-col gap-5">
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 text-sm font-bold text-ink-900">
          Diode law for the bias point
        </legend>
        <div className="flex flex-wrap gap-x-5 gap-y-2">
          {diodeLaws.map((law) => (
            <label key={law} className="flex items-center gap-2 text-sm text-ink-900">
              <input
                type="radio"
                value={law}
                className="size-4 accent-accent"
                {...register('diodeLaw')}
              />
              {diodeLawLabels[law]}
            </label>
          ))}
        </div>
        <div className="grid gap-3 sm:grid-cols-3">
          {text('vOn', 'Constant-drop VON (V)')}
          {text('v0', 'Piecewise-linear V0 (V)')}
          {text('rd', 'Piecewise-linear rD (Ω)')}
        </div>
        <p className="text-xs text-ink-600">
          Transistors always use their full models. The law comparison uses these figures for every
          law.
        </p>
      </fieldset>

      <fieldset className="grid gap-3 sm:grid-cols-3">
        <legend className="mb-1 text-sm font-bold text-ink-900">Circuit and signal</legend>
        {text('temperature', 'Temperature (°C)')}
        <Select label="Input source" registration={register('inputSource')}>
          <option value="">{sources.length === 0 ? 'No source yet' : 'Choose…'}</option>
          {sources.map((s) => (
            <option key={s.name} value={s.name}>
              {s.name}
            </option>
          ))}
        </Select>
        <Select label="Output node" registration={register('outputNode')}>
          <option value="">{nodes.length === 0 ? 'No node yet' : 'Choose…'}</option>
          {nodes.map((n) => (
            <option key={n} value={n}>
              {n}
            </option>
          ))}
        </Select>
        {text('frequency', 'Analysis frequency (Hz)', 'Gain, Zin and Zout are given here.')}
        {text('amplitude', `Signal amplitude, peak (${amplitudeUnit})`)}
        {text('errorLimit', 'Error limit (%)')}
      </fieldset>

      <fieldset className="grid gap-3 sm:grid-cols-4">
        <legend className="mb-1 text-sm font-bold text-ink-900">Frequency sweep</legend>
        <Select label="Spacing" registration={register('sweepType')}>
          <option value="dec">Per decade</option>
          <option value="oct">Per octave</option>
          <option value="lin">Linear</option>
        </Select>
        {text('points', 'Points')}
        {text('fstart', 'Start (Hz)')}
        {text('fstop', 'Stop (Hz)')}
      </fieldset>
    </form>
  );
}
