import type { Limit } from '@biasproof/calc';
import { memo } from 'react';
import { ResultNumber } from '@/features/worksheets/components/results/result-cells.tsx';
import { MarkedResult } from '@/features/worksheets/components/results/result-marks.tsx';
import type { ResultRow } from '@/features/worksheets/components/results/result-csv.ts';
import { ResultTable } from '@/features/worksheets/components/results/result-table.tsx';
import { LazyHistogramPlot } from '@/features/worksheets/components/variation/lazy-variation-plots.tsx';
import type { ShownMonteCarlo } from '@/features/worksheets/components/variation/shown-monte-carlo.ts';
import { unitOfPath } from '@/features/worksheets/components/variation/variation-targets.ts';

const statistics = [
  ['mean', 'Mean'],
  ['sigma', 'σ'],
  ['min', 'Min'],
  ['max', 'Max'],
  ['p00135', '0.135 %'],
  ['p50', 'Median'],
  ['p99865', '99.865 %'],
] as const;

/**
 * A Monte Carlo result: yield, samples that did not solve, statistics and the histogram.
 * Memoized: a new run's progress re-renders the panel around it many times a second.
 */
export const MonteCarloResults = memo(function MonteCarloResults({
  result,
  origin,
  limits,
  shownPath,
}: ShownMonteCarlo & {
  limits: readonly Limit[];
  /** The result whose histogram is drawn. */
  shownPath: string;
}) {
  const paths = Object.keys(result.probes);
  const histogramPath = result.probes[shownPath] ? shownPath : paths[0];
  const summary = histogramPath ? result.probes[histogramPath] : undefined;
  const rows: ResultRow[] = paths.map((path) => {
    const s = result.probes[path]!.statistics;
    const unit = unitOfPath(path);
    return {
      key: path,
      cells: [
        { text: path },
        ...statistics.map(([key]) => ({
          value: Number.isFinite(s[key]) ? s[key] : null,
          unit,
          path: `variation.monteCarlo.${path}.${key}`,
        })),
      ],
    };
  });
  const bounds = histogramPath
    ? limits
        .filter((l) => l.path === histogramPath)
        .flatMap((l) => [
          ...(l.min === undefined ? [] : [{ value: l.min, label: 'min' }]),
          ...(l.max === undefined ? [] : [{ value: l.max, label: 'max' }]),
        ])
    : [];

  return (
    <div className="flex flex-col gap-3" data-testid="monte-carlo-result">
      <p className="text-sm text-ink-700">
        {origin === 'run' ? 'Run in this browser' : 'From the worksheet’s results'}:{' '}
        <MarkedResult path="variation.monteCarlo.samples" className="tabular-nums">
          {result.samples}
        </MarkedResult>{' '}
        samples, seed “
        <MarkedResult path="variation.monteCarlo.seed" className="">
          {result.seed}
        </MarkedResult>
        ”, at {result.temperature} °C.
      </p>
      <dl className="grid gap-x-6 gap-y-1 text-sm sm:grid-cols-[auto_1fr]">
        <dt className="font-semibold text-ink-700">Yield</dt>
        <dd>
          {result.yield ? (
            <>
              <ResultNumber
                value={result.yield.fraction * 100}
                unit="%"
                path="variation.monteCarlo.yield"
              />{' '}
              <span className="text-ink-600">
                ({result.yield.passed} of {result.samples} samples within every limit)
              </span>
            </>
          ) : (
            <span className="text-ink-600">No limits: add one in Limits and checks.</span>
          )}
        </dd>
        <dt className="font-semibold text-ink-700">Did not solve</dt>
        <dd>
          <MarkedResult path="variation.monteCarlo.failed" className="tabular-nums">
            {result.failed}
          </MarkedResult>{' '}
          <span className="text-ink-600">
            {result.failed > 0 ? '(counted outside the limits)' : 'samples'}
          </span>
        </dd>
      </dl>
      {histogramPath && summary ? (
        <LazyHistogramPlot
          path={histogramPath}
          unit={unitOfPath(histogramPath)}
          histogram={summary.histogram}
          count={summary.statistics.count}
          nominal={result.nominal[histogramPath]}
          bounds={bounds}
        />
      ) : null}
      <ResultTable
        title="Monte Carlo statistics"
        columns={['Result', ...statistics.map(([, label]) => label)]}
        rows={rows}
        note={`0.135 % and 99.865 % are the ±3σ points of a normal distribution. Generator: ${result.generator}.`}
      />
      {result.failures.length > 0 ? (
        <details className="text-xs text-ink-700">
          <summary className="cursor-pointer font-semibold">Samples that did not solve</summary>
          <ul className="mt-2 flex list-disc flex-col gap-1 pl-5">
            {result.failures.map((f) => (
              <li key={f.sample}>
                Sample {f.sample + 1}: {f.message}
              </li>
            ))}
          </ul>
        </details>
      ) : null}
    </div>
  );
});
