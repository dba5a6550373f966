import { Bar, BarChart, CartesianGrid, ReferenceLine, Tooltip, XAxis, YAxis } from 'recharts';
import { plotColours, roundTicks } from '@/features/worksheets/components/plots/plot-format.ts';
import { useChartWidth } from '@/features/worksheets/components/plots/use-chart-width.ts';
import { formatResult } from '@/features/worksheets/components/results/result-format.ts';

export interface SensitivityPlotProps {
  path: string;
  entries: { parameter: string; normalized: number | null }[];
}

const number = (x: number) => formatResult(x, '', 3);

/** Normalized sensitivity of one result to each parameter, as horizontal bars about zero. */
export function SensitivityPlot({ path, entries }: SensitivityPlotProps) {
  const { ref, width } = useChartWidth();
  const data = entries.map((e) => ({ parameter: e.parameter, value: e.normalized ?? 0 }));
  const extreme = Math.max(1e-9, ...data.map((d) => Math.abs(d.value)));
  const largest = [...entries]
    .filter((e) => e.normalized !== null)
    .sort((a, b) => Math.abs(b.normalized!) - Math.abs(a.normalized!))[0];
  return (
    <figure ref={ref} className="flex flex-col gap-1">
      <figcaption className="text-sm font-bold text-ink-900">Sensitivities of {path}</figcaption>
      <div
        role="img"
        aria-label={`Normalized sensitivities of ${path} to ${entries.length} parameters${largest ? `; largest ${largest.parameter} at ${number(largest.normalized!)} % per %` : ''}`}
      >
        <BarChart
          width={width}
          height={48 + 30 * data.length}
          data={data}
          layout="vertical"
          margin={{ top: 8, right: 24, bottom: 8, left: 8 }}
        >
          <CartesianGrid stroke={plotColours.grid} horizontal={false} />
          <XAxis
            type="number"
            domain={[-extreme * 1.1, extreme * 1.1]}
            ticks={roundTicks(-extreme, extreme, 6)}
            tickFormatter={number}
            allowDataOverflow
          />
          <YAxis type="category" dataKey="parameter" width={96} />
          <ReferenceLine x={0} stroke={plotColours.ink} />
          <Tooltip formatter={(v) => [`${number(Number(v))} % per %`, 'Sensitivity']} />
          <Bar dataKey="value" fill={plotColours.primary} isAnimationActive={false} />
        </BarChart>
      </div>
    </figure>
  );
}
