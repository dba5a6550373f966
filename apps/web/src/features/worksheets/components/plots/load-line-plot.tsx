import { formatValue, type LoadLineResult } from '@biasproof/calc';
import {
  CartesianGrid,
  ComposedChart,
  Legend,
  Line,
  Scatter,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import {
  plotColours,
  roundTicks,
  tick,
} from '@/features/worksheets/components/plots/plot-format.ts';
import { useChartWidth } from '@/features/worksheets/components/plots/use-chart-width.ts';

interface LoadLinePlotProps {
  picture: LoadLineResult;
  /** The device as the author named it. */
  deviceName: string;
}

/** Device curve, load line, Q-point and the tangent at Q, in the junction's own V–I plane. */
export function LoadLinePlot({ picture, deviceName }: LoadLinePlotProps) {
  const { ref, width } = useChartWidth();
  const { curve, loadLine, tangent, q } = picture;
  const current = picture.junction === 'BE' ? 'base current IB' : 'diode current ID';
  const voltage = picture.junction === 'BE' ? 'base-emitter voltage VBE' : 'junction voltage VD';
  const capital = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);
  const vMin = curve[0]?.v ?? 0;
  const vMax = curve.at(-1)?.v ?? 1;
  const iMax = 1.3 * Math.max(q.i, loadLine[1].i, 1e-12);
  const series = [
    { name: 'Device curve', data: curve, colour: plotColours.primary, dash: undefined },
    { name: 'Load line', data: loadLine, colour: plotColours.secondary, dash: undefined },
    { name: 'Tangent at Q', data: tangent, colour: plotColours.ink, dash: '5 4' },
  ];

  return (
    <figure ref={ref} className="flex flex-col gap-1">
      <figcaption className="text-sm font-bold text-ink-900">
        {deviceName}: {current} against {voltage}
      </figcaption>
      <div
        role="img"
        aria-label={`${deviceName} load-line plot: Q-point at ${formatValue(q.v, 'V')} and ${formatValue(q.i, 'A')}`}
      >
        <ComposedChart
          width={width}
          height={300}
          margin={{ top: 12, right: 24, bottom: 36, left: 8 }}
        >
          <CartesianGrid stroke={plotColours.grid} />
          <XAxis
            dataKey="v"
            type="number"
            domain={[vMin, vMax]}
            allowDataOverflow
            ticks={roundTicks(vMin, vMax)}
            tickFormatter={tick('V')}
            label={{
              value: `${capital(voltage)} (V)`,
              position: 'insideBottom',
              offset: -22,
              fill: plotColours.ink,
              fontSize: 12,
            }}
          />
          <YAxis
            dataKey="i"
            type="number"
            domain={[0, iMax]}
            allowDataOverflow
            ticks={roundTicks(0, iMax, 5)}
            tickFormatter={tick('A')}
            width={88}
            label={{
              value: `${capital(current)} (A)`,
              angle: -90,
              position: 'insideLeft',
              style: { textAnchor: 'middle' },
              fill: plotColours.ink,
              fontSize: 12,
            }}
          />
          <Tooltip
            formatter={(value, name) => [formatValue(Number(value), 'A'), String(name)]}
            labelFormatter={(v) => `${capital(voltage)} ${formatValue(Number(v), 'V')}`}
          />
          <Legend verticalAlign="top" height={28} />
          {series.map((s) => (
            <Line
              key={s.name}
              name={s.name}
              data={s.data}
              dataKey="i"
              type="linear"
              dot={false}
              stroke={s.colour}
              strokeDasharray={s.dash}
              strokeWidth={2}
              isAnimationActive={false}
            />
          ))}
          <Scatter
            name="Q-point"
            data={[q]}
            dataKey="i"
            fill={plotColours.marker}
            isAnimationActive={false}
          />
        </ComposedChart>
      </div>
    </figure>
  );
}
