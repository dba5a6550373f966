import { formatValue, type Histogram } from '@biasproof/calc';
import { Bar, BarChart, CartesianGrid, ReferenceLine, Tooltip, XAxis, YAxis } from 'recharts';
import {
  plotColours,
  roundTicks,
  tick,
} from '@/features/worksheets/components/plots/plot-format.ts';
import { useChartWidth } from '@/features/worksheets/components/plots/use-chart-width.ts';

export interface HistogramPlotProps {
  path: string;
  unit: string;
  histogram: Histogram;
  /** Samples the histogram counts (converged ones). */
  count: number;
  nominal: number | undefined;
  /** Bounds of the limits on this result, drawn as lines. */
  bounds: { value: number; label: string }[];
}

const height = 240;
const margin = { top: 28, right: 24, bottom: 28, left: 8 };
const yAxisWidth = 56;

/** Monte Carlo histogram of one result, with the limits and the nominal value marked. */
export function HistogramPlot({
  path,
  unit,
  histogram,
  count,
  nominal,
  bounds,
}: HistogramPlotProps) {
  const { ref, width } = useChartWidth();
  const { edges, counts } = histogram;
  const first = edges[0] ?? 0;
  const last = edges.at(-1) ?? first;
  const data = counts.map((n, i) => ({
    x: ((edges[i] ?? 0) + (edges[i + 1] ?? 0)) / 2,
    from: edges[i] ?? 0,
    to: edges[i + 1] ?? 0,
    count: n,
  }));
  const marks = [...bounds.map((b) => b.value), first, last];
  let lo = Math.min(...marks);
  let hi = Math.max(...marks);
  const pad = hi > lo ? (hi - lo) * 0.04 : Math.abs(lo) * 0.01 || 1;
  lo -= pad;
  hi += pad;
  const plotWidth = Math.max(50, width - margin.left - margin.right - yAxisWidth);
  const binWidth = counts.length > 0 ? (last - first) / counts.length : 0;
  const barSize = Math.max(1, Math.floor((plotWidth * binWidth) / (hi - lo)) - 1);
  const limitsText =
    bounds.length > 0
      ? `; limits ${bounds.map((b) => `${b.label} ${formatValue(b.value, unit)}`).join(', ')}`
      : '';

  return (
    <figure ref={ref} className="flex flex-col gap-1">
      <figcaption className="text-sm font-bold text-ink-900">Histogram: {path}</figcaption>
      <div
        role="img"
        aria-label={`Histogram of ${path}: ${count} samples from ${formatValue(first, unit)} to ${formatValue(last, unit)}${limitsText}`}
      >
        <BarChart width={width} height={height} data={data} margin={margin} barGap={0}>
          <CartesianGrid stroke={plotColours.grid} vertical={false} />
          <XAxis
            dataKey="x"
            type="number"
            domain={[lo, hi]}
            ticks={roundTicks(lo, hi)}
            tickFormatter={tick(unit)}
            allowDataOverflow
          />
          <YAxis width={yAxisWidth} allowDecimals={false} />
          <Tooltip
            labelFormatter={(_, items) => {
              const bin = items[0]?.payload as { from: number; to: number } | undefined;
              return bin ? `${formatValue(bin.from, unit)} to ${formatValue(bin.to, unit)}` : '';
            }}
            formatter={(v) => [String(v), 'Samples']}
          />
          <Bar
            dataKey="count"
            fill={plotColours.primary}
            barSize={barSize}
            isAnimationActive={false}
          />
          {nominal === undefined ? null : (
            <ReferenceLine
              x={nominal}
              stroke={plotColours.ink}
              strokeDasharray="4 3"
              label={{ value: 'nominal', position: 'top', fill: plotColours.ink, fontSize: 11 }}
            />
          )}
          {bounds.map((b) => (
            <ReferenceLine
              key={`${b.label}-${b.value}`}
              x={b.value}
              stroke={plotColours.secondary}
              strokeWidth={2}
              label={{
                value: `${b.label} ${formatValue(b.value, unit, { digits: 3 })}`,
                position: 'top',
                fill: plotColours.secondary,
                fontSize: 11,
              }}
            />
          ))}
        </BarChart>
      </div>
    </figure>
  );
}
