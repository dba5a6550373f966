import { zodResolver } from '@hookform/resolvers/zod';
import {
  MAX_MONTE_CARLO_SAMPLES,
  STORED_MONTE_CARLO_SAMPLES,
  type WorksheetVariationResults,
} from '@biasproof/calc';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { Button } from '@/components/ui/button.tsx';
import { ErrorMessage } from '@/components/ui/message.tsx';
import { TextField } from '@/components/ui/text-field.tsx';
import { MonteCarloResults } from '@/features/worksheets/components/variation/monte-carlo-results.tsx';
import { shownMonteCarlo } from '@/features/worksheets/components/variation/shown-monte-carlo.ts';
import {
  useMonteCarloState,
  type MonteCarloRun,
} from '@/features/worksheets/components/variation/use-monte-carlo-run.ts';
import {
  followedPaths,
  monteCarloKey,
  monteCarloRequest,
  variationEdit,
  variationOf,
  type VariationEditing,
} from '@/features/worksheets/components/variation/variation-draft.ts';

const runFormSchema = z.object({
  samples: z
    .string()
    .transform((t) => t.replace(/[\s_]/g, ''))
    .pipe(z.string().regex(/^\d+$/, 'Enter a whole number of samples.'))
    .transform(Number)
    .pipe(
      z
        .number()
        .min(1, 'At least 1 sample.')
        .max(MAX_MONTE_CARLO_SAMPLES, `At most ${MAX_MONTE_CARLO_SAMPLES} samples.`),
    ),
  seed: z.string().trim().min(1, 'Enter a seed.').max(200, 'At most 200 characters.'),
});
type RunFormValues = z.input<typeof runFormSchema>;
type RunChoice = z.output<typeof runFormSchema>;

function Progress({ done, total }: { done: number; total: number }) {
  const percent = total > 0 ? (done / total) * 100 : 0;
  return (
    <div className="flex flex-col gap-1">
      <div
        role="progressbar"
        aria-label="Monte Carlo progress"
        aria-valuemin={0}
        aria-valuemax={total}
        aria-valuenow={done}
        aria-valuetext={`${done} of ${total} samples`}
        className="h-3 w-full overflow-hidden rounded-full bg-paper ring-1 ring-inset ring-ink-300"
      >
        <div className="h-full bg-accent" style={{ width: `${percent}%` }} />
      </div>
      <p className="text-xs text-ink-700">
        {done} of {total} samples solved
      </p>
    </div>
  );
}

/**
 * Monte Carlo in a worker: samples and seed, a progress bar and Cancel. A completed run writes
 * its samples and seed into the draft, so the revision records exactly the run the author saw.
 */
export function MonteCarloPanel({
  editing,
  results,
  run,
  shownPath,
}: {
  editing: VariationEditing;
  results: WorksheetVariationResults | undefined;
  run: MonteCarloRun;
  shownPath: string;
}) {
  const { draft, edit, readOnly } = editing;
  const v = variationOf(draft.settings);
  const recorded = v.monteCarlo;
  const ready = v.parameters.length > 0 && followedPaths(v).length > 0;
  const {
    register,
    handleSubmit,
    formState: { errors },
  } = useForm<RunFormValues, unknown, RunChoice>({
    resolver: zodResolver(runFormSchema),
    defaultValues: {
      samples: String(recorded.samples > 0 ? recorded.samples : STORED_MONTE_CARLO_SAMPLES),
      seed: String(recorded.seed),
    },
  });
  const state = useMonteCarloState(run);
  const running = state.status === 'running';
  const shown = shownMonteCarlo(draft, results, state);

  function start(form: RunChoice) {
    // A checker reruns the recorded run as it is (the seed keeps its type, so the key matches).
    const choice = readOnly ? recorded : form;
    const key = monteCarloKey(draft, choice);
    run.start(monteCarloRequest(draft, choice), key, (_, now) => {
      // Only a run of the draft as it still is may be recorded in it.
      if (monteCarloKey(now, choice) !== key) return false;
      if (!readOnly) edit(variationEdit(now.settings, { monteCarlo: choice }));
      return true;
    });
  }

  if (readOnly && recorded.samples === 0 && !shown)
    return <p className="text-sm text-ink-600">The author has not run a Monte Carlo.</p>;

  return (
    <div className="flex flex-col gap-3">
      <form
        noValidate
        aria-label="Monte Carlo run"
        onSubmit={(event) => void handleSubmit(start)(event)}
        className="flex flex-wrap items-end gap-3"
      >
        <TextField
          label="Samples"
          inputMode="numeric"
          autoComplete="off"
          readOnly={readOnly}
          error={errors.samples?.message}
          className="w-32"
          {...register('samples')}
        />
        <TextField
          label="Seed"
          autoComplete="off"
          spellCheck={false}
          readOnly={readOnly}
          error={errors.seed?.message}
          className="w-40"
          {...register('seed')}
        />
        <div className="flex gap-2 pb-0.5">
          <Button type="submit" disabled={!ready || running}>
            {readOnly ? 'Run the recorded Monte Carlo' : 'Run Monte Carlo'}
          </Button>
          {running ? (
            <Button variant="dangerOutline" onClick={run.cancel}>
              Cancel
            </Button>
          ) : null}
        </div>
      </form>
      {ready ? null : (
        <p className="text-sm text-ink-600">
          Add a varied parameter and a limit, hand check or result to follow first.
        </p>
      )}
      <p className="text-xs text-ink-600">
        The same seed gives the same samples on any machine. Runs of up to{' '}
        {STORED_MONTE_CARLO_SAMPLES} samples are stored with the revision; a larger run records its
        samples and seed, and shows again when run here.
      </p>
      {running ? <Progress done={state.done} total={state.total} /> : null}
      <p role="status" className="text-sm text-ink-700">
        {state.status === 'cancelled'
          ? `Cancelled after ${state.done} of ${state.total} samples. Nothing was recorded.`
          : state.status === 'stale'
            ? 'The circuit or the setup changed during the run, so its result is not shown. Run it again.'
            : ''}
      </p>
      {state.status === 'failed' ? (
        <ErrorMessage>The Monte Carlo run stopped: {state.message}</ErrorMessage>
      ) : null}
      {shown ? (
        <MonteCarloResults
          result={shown.result}
          origin={shown.origin}
          limits={v.limits}
          shownPath={shownPath}
        />
      ) : recorded.samples > STORED_MONTE_CARLO_SAMPLES && !running ? (
        <p className="rounded-md border border-dashed border-ink-300 px-4 py-4 text-sm text-ink-700">
          This worksheet records a run of {recorded.samples} samples with seed “
          {String(recorded.seed)}”. Runs of more than {STORED_MONTE_CARLO_SAMPLES} samples are not
          stored; run it again to see it.
        </p>
      ) : null}
    </div>
  );
}
