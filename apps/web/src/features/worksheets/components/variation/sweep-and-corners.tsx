import {
  formatValue,
  type CornersResult,
  type RssResult,
  type TemperatureSweepResult,
} from '@biasproof/calc';
import type { ResultRow } from '@/features/worksheets/components/results/result-csv.ts';
import { ResultTable } from '@/features/worksheets/components/results/result-table.tsx';
import { unitOfPath } from '@/features/worksheets/components/variation/variation-targets.ts';

/** Every followed result at every temperature of the sweep. */
export function TemperatureTable({ sweep }: { sweep: TemperatureSweepResult }) {
  const rows: ResultRow[] = sweep.points.map((point) => ({
    key: String(point.temperature),
    cells: [
      {
        text: point.ok
          ? formatValue(point.temperature, '°C')
          : `${formatValue(point.temperature, '°C')} (did not solve: ${point.error?.message ?? 'unknown'})`,
      },
      ...sweep.probes.map((path) => ({
        value: point.values?.[path] ?? null,
        unit: unitOfPath(path),
        path: `variation.temperatures.${point.temperature}.${path}`,
      })),
    ],
  }));
  return (
    <ResultTable
      title="Values over temperature"
      columns={['Temperature', ...sweep.probes]}
      rows={rows}
      note="Parameters at nominal, scaled by their tempcos; devices scale as SPICE scales them (IS with XTI and EG, VT, β with XTB)."
    />
  );
}

/**
 * The parameters at a corner, most influential first when sensitivities are known: these are
 * the parts that drive the result to its extreme.
 */
function drivers(
  at: Record<string, number>,
  parameters: CornersResult['parameters'],
  influence: Map<string, number> | undefined,
  show: (id: string) => string,
): string {
  const ordered = [...parameters].sort(
    (a, b) => (influence?.get(b.id) ?? 0) - (influence?.get(a.id) ?? 0),
  );
  const words = ordered
    .filter((p) => at[p.id] !== undefined)
    .map((p) => `${show(p.id)} ${at[p.id] === p.low ? 'low' : 'high'}`);
  return words.length > 0 ? words.join(', ') : '—';
}

/** Each followed result's lowest and highest value over the tolerance corners, and where. */
export function CornersTable({
  corners,
  rss,
  show,
}: {
  corners: CornersResult;
  rss: RssResult | null;
  show: (id: string) => string;
}) {
  const rows: ResultRow[] = Object.entries(corners.probes).map(([path, c]) => {
    const entries = rss?.sensitivities.byProbe[path];
    const influence = entries
      ? new Map(entries.map((e) => [e.parameter, Math.abs(e.normalized ?? 0)]))
      : undefined;
    const unit = unitOfPath(path);
    const base = `variation.corners.${path}`;
    return {
      key: path,
      cells: [
        { text: path },
        { value: c.nominal, unit, path: `${base}.nominal` },
        { value: c.min, unit, path: `${base}.min` },
        { text: drivers(c.minAt, corners.parameters, influence, show) },
        { value: c.max, unit, path: `${base}.max` },
        { text: drivers(c.maxAt, corners.parameters, influence, show) },
      ],
    };
  });
  const k = corners.parameters.length;
  const method =
    corners.method === 'exhaustive'
      ? `Every combination of the ${k} toleranced parameters at their ends (${corners.evaluated} corners).`
      : `${k} toleranced parameters: each at the end its sensitivity points to, then refined one flip at a time (${corners.evaluated} corners solved).`;
  const failed =
    corners.failed > 0 ? ` ${corners.failed} corners did not solve and are left out.` : '';
  return (
    <ResultTable
      title="Lowest and highest over the corners"
      columns={['Result', 'Nominal', 'Min', 'Min at', 'Max', 'Max at']}
      rows={rows}
      note={`${method}${failed} Parameters are listed most influential first.`}
    />
  );
}
