import { CartesianGrid, Line, LineChart, ReferenceLine, Tooltip, XAxis, YAxis } from 'recharts';
import { formatValue, type SweepFigures } from '@biasproof/calc';
import {
  decadeTicks,
  plotColours,
  tick,
} from '@/features/worksheets/components/plots/plot-format.ts';
import { useChartWidth } from '@/features/worksheets/components/plots/use-chart-width.ts';

interface BodePlotProps {
  sweep: SweepFigures;
  /** Frequency the gain table is given at, Hz (marked on both plots). */
  analysisFrequency: number;
}

const height = 220;
const margin = { top: 24, right: 24, bottom: 28, left: 8 };

/** Magnitude and phase against log frequency, with midband gain and −3 dB corners marked. */
export function BodePlot({ sweep, analysisFrequency }: BodePlotProps) {
  const { ref, width } = useChartWidth();
  const data = sweep.freq.map((f, i) => ({ f, db: sweep.db[i] ?? 0, deg: sweep.deg[i] ?? 0 }));
  const lo = sweep.freq[0] ?? 1;
  const hi = sweep.freq.at(-1) ?? 10;
  const ticks = decadeTicks(lo, hi);
  const corners = [sweep.lowCornerHz, sweep.highCornerHz].filter((f): f is number => f !== null);
  const xAxis = (label: string) => (
    <XAxis
      dataKey="f"
      type="number"
      scale="log"
      domain={[lo, hi]}
      ticks={ticks}
      tickFormatter={tick('Hz')}
      allowDataOverflow
      label={{
        value: label,
        position: 'insideBottom',
        offset: -18,
        fill: plotColours.ink,
        fontSize: 12,
      }}
    />
  );
  const markers = (withLabels: boolean) => [
    ...corners.map((f) => (
      <ReferenceLine
        key={`corner-${f}`}
        x={f}
        stroke={plotColours.secondary}
        strokeDasharray="4 3"
        label={
          withLabels
            ? {
                value: `−3 dB ${formatValue(f, 'Hz', { digits: 3 })}`,
                position: 'top',
                fill: plotColours.secondary,
                fontSize: 11,
              }
            : undefined
        }
      />
    )),
    analysisFrequency >= lo && analysisFrequency <= hi ? (
      <ReferenceLine
        key="analysis"
        x={analysisFrequency}
        stroke={plotColours.marker}
        strokeDasharray="1 3"
      />
    ) : null,
  ];
  const tooltip = (
    <Tooltip
      labelFormatter={(f) => formatValue(Number(f), 'Hz')}
      formatter={(v, name) => [
        name === 'db' ? formatValue(Number(v), 'dB') : formatValue(Number(v), '°'),
        name === 'db' ? 'Magnitude' : 'Phase',
      ]}
    />
  );

  return (
    <figure ref={ref} className="flex flex-col gap-1">
      <figcaption className="text-sm font-bold text-ink-900">
        Bode plot: V(output) / input
      </figcaption>
      <div
        role="img"
        aria-label={`Magnitude in dB against frequency from ${formatValue(lo, 'Hz')} to ${formatValue(hi, 'Hz')}; midband ${formatValue(sweep.midbandDb, 'dB')}`}
      >
        <LineChart width={width} height={height} data={data} margin={margin}>
          <CartesianGrid stroke={plotColours.grid} />
          {xAxis('Frequency (Hz)')}
          <YAxis
            dataKey="db"
            tickFormatter={tick('dB')}
            width={84}
            label={{
              value: 'Magnitude (dB)',
              angle: -90,
              position: 'insideLeft',
              style: { textAnchor: 'middle' },
              fill: plotColours.ink,
              fontSize: 12,
            }}
            domain={['auto', 'auto']}
          />
          <ReferenceLine
            y={sweep.midbandDb}
            stroke={plotColours.ink}
            strokeDasharray="6 3"
            label={{
              value: 'midband',
              position: 'insideTopRight',
              fill: plotColours.ink,
              fontSize: 11,
            }}
          />
          <ReferenceLine
            y={sweep.midbandDb - 3.0103}
            stroke={plotColours.secondary}
            strokeDasharray="2 3"
          />
          {markers(true)}
          {tooltip}
          <Line
            dataKey="db"
            type="monotone"
            dot={false}
            stroke={plotColours.primary}
            strokeWidth={2}
            isAnimationActive={false}
          />
        </LineChart>
      </div>
      <div role="img" aria-label="Phase in degrees against frequency">
        <LineChart width={width} height={height} data={data} margin={margin}>
          <CartesianGrid stroke={plotColours.grid} />
          {xAxis('Frequency (Hz)')}
          <YAxis
            dataKey="deg"
            tickFormatter={tick('°')}
            width={84}
            label={{
              value: 'Phase (°)',
              angle: -90,
              position: 'insideLeft',
              style: { textAnchor: 'middle' },
              fill: plotColours.ink,
              fontSize: 12,
            }}
            domain={['auto', 'auto']}
          />
          {markers(false)}
          {tooltip}
          <Line
            dataKey="deg"
            type="monotone"
            dot={false}
            stroke={plotColours.ink}
            strokeWidth={2}
            isAnimationActive={false}
          />
        </LineChart>
      </div>
    </figure>
  );
}
