import type { DeratingPolicy, PartStressResult, StressQuantity } from '@biasproof/calc';
import type { ResultRow } from '@/features/worksheets/components/results/result-csv.ts';
import { ResultTable } from '@/features/worksheets/components/results/result-table.tsx';
import { statusLooks } from '@/features/worksheets/components/variation/status-chip.tsx';

const quantityWords: Record<StressQuantity, string> = {
  power: 'Power',
  current: 'Current',
  voltage: 'Voltage',
  'reverse-voltage': 'Reverse voltage',
  'junction-temperature': 'Junction temperature',
};

const policyWords: [keyof Omit<DeratingPolicy, 'name' | 'junctionTemperature'>, string][] = [
  ['resistorPower', 'Resistor power'],
  ['diodeForwardCurrent', 'Diode forward current'],
  ['diodeReverseVoltage', 'Diode reverse voltage'],
  ['diodePower', 'Diode power'],
  ['transistorPower', 'Transistor power'],
  ['transistorCurrent', 'Transistor current'],
  ['transistorVoltage', 'Transistor voltage'],
];

/** Each part's stress against its derated ratings, with pass / warn / fail in words and icons. */
export function StressSection({
  stress,
  show,
}: {
  stress: PartStressResult;
  show: (name: string) => string;
}) {
  const rows: ResultRow[] = stress.rows.flatMap((row) =>
    row.checks.map((c) => {
      const base = `variation.stress.${row.element}.${c.quantity}`;
      const look = statusLooks[c.status];
      return {
        key: `${row.element}-${c.quantity}`,
        cells: [
          { text: show(row.element) },
          { text: quantityWords[c.quantity] },
          { value: c.value, unit: c.unit, path: base },
          { value: c.rating, unit: c.unit, path: `${base}.rating` },
          { value: c.allowed, unit: c.unit, path: `${base}.allowed` },
          { value: c.usePercent, unit: '%', path: `${base}.use` },
          {
            chip: `${look.icon} ${look.word}`,
            tone: look.tone,
            path: `${base}.status`,
            title:
              c.status === 'warn'
                ? 'Within the rating but above what the derating policy allows'
                : c.status === 'fail'
                  ? 'Above the rating'
                  : c.status === 'unrated'
                    ? 'No rating given'
                    : 'Within the derated rating',
          },
        ],
      };
    }),
  );
  const { policy } = stress;
  return (
    <>
      <ResultTable
        title="Stress against the derated ratings"
        columns={['Part', 'Quantity', 'Stress', 'Rating', 'Allowed', 'Use of rating', 'Status']}
        rows={rows}
        note={`Allowed = derating factor × rating (${policy.name}); junction temperature = ambient ${stress.ambient} °C + θJA·P.`}
      />
      <details className="text-xs text-ink-700">
        <summary className="cursor-pointer font-semibold">
          Where the derating factors come from
        </summary>
        <ul className="mt-2 flex list-disc flex-col gap-1 pl-5">
          {policyWords.map(([key, words]) => (
            <li key={key}>
              {words}: {policy[key].factor} × rating. {policy[key].source}
            </li>
          ))}
          <li>
            Junction temperature: at least {policy.junctionTemperature.marginKelvin} K below the
            rated maximum. {policy.junctionTemperature.source}
          </li>
        </ul>
      </details>
    </>
  );
}
