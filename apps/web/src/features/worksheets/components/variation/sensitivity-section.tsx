import type { RssResult } from '@biasproof/calc';
import type { ResultRow } from '@/features/worksheets/components/results/result-csv.ts';
import { ResultTable } from '@/features/worksheets/components/results/result-table.tsx';
import { LazySensitivityPlot } from '@/features/worksheets/components/variation/lazy-variation-plots.tsx';
import { unitOfPath } from '@/features/worksheets/components/variation/variation-targets.ts';

/** Normalized sensitivities (chart and table) and the RSS spread they give. */
export function SensitivitySection({
  rss,
  shownPath,
  show,
}: {
  rss: RssResult;
  /** The result the chart is drawn for. */
  shownPath: string;
  show: (id: string) => string;
}) {
  const { sensitivities } = rss;
  const chartPath = sensitivities.byProbe[shownPath] ? shownPath : sensitivities.probes[0];
  const rssRows: ResultRow[] = Object.entries(rss.probes).map(([path, r]) => {
    const unit = unitOfPath(path);
    const base = `variation.rss.${path}`;
    return {
      key: path,
      cells: [
        { text: path },
        { value: r.nominal, unit, path: `${base}.nominal` },
        { value: r.sigma, unit, path: `${base}.sigma` },
        { value: r.low3Sigma, unit, path: `${base}.low3Sigma` },
        { value: r.high3Sigma, unit, path: `${base}.high3Sigma` },
        { value: r.linearWorstCase, unit, path: `${base}.linearWorstCase` },
      ],
    };
  });
  const sensitivityRows: ResultRow[] = sensitivities.parameters.map((p, i) => ({
    key: p.id,
    cells: [
      { text: show(p.id) },
      ...sensitivities.probes.map((path) => ({
        value: sensitivities.byProbe[path]?.[i]?.normalized ?? null,
        unit: '',
        path: `variation.sensitivities.${path}.${p.id}`,
      })),
    ],
  }));
  return (
    <>
      {chartPath ? (
        <LazySensitivityPlot
          path={chartPath}
          entries={(sensitivities.byProbe[chartPath] ?? []).map((e) => ({
            parameter: show(e.parameter),
            normalized: e.normalized,
          }))}
        />
      ) : null}
      <ResultTable
        title="Normalized sensitivities (% of result per % of parameter)"
        columns={['Parameter', ...sensitivities.probes]}
        rows={sensitivityRows}
        note="Central differences about nominal; — where the result or the parameter is 0 or a perturbed solve failed."
      />
      <ResultTable
        title="RSS estimate"
        columns={['Result', 'Nominal', 'σ (RSS)', '−3σ', '+3σ', 'Linear worst case ±']}
        rows={rssRows}
        note={rss.caveat}
      />
    </>
  );
}
