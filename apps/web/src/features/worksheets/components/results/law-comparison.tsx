import {
  diodeLawLabels,
  type DeviceOp,
  type DiodeLaw,
  type DiodeLawComparison,
  type Outcome,
} from '@biasproof/calc';
import { EngineErrorNotice } from '@/features/worksheets/components/results/engine-error-notice.tsx';
import type { ResultCell, ResultRow } from '@/features/worksheets/components/results/result-csv.ts';
import { ResultTable } from '@/features/worksheets/components/results/result-table.tsx';

const mainCurrent = (d: DeviceOp): number => (d.kind === 'Q' ? d.ic : d.id);
const currentLabel = (d: DeviceOp): string => (d.kind === 'Q' ? 'IC' : 'ID');

interface LawComparisonProps {
  comparison: Outcome<DiodeLawComparison>;
  selected: DiodeLaw;
  show: (name: string) => string;
}

/**
 * The bias point under every diode law, each beside its difference from the exponential law:
 * the evidence for (or against) a quick hand analysis with a simpler law.
 */
export function LawComparison({ comparison, selected, show }: LawComparisonProps) {
  if (!comparison.ok) {
    return (
      <EngineErrorNotice
        title="The diode-law comparison could not be made"
        error={comparison.error}
        show={show}
      />
    );
  }
  const { reference, laws } = comparison.value;
  const columns = ['Quantity'];
  for (const l of laws) {
    const name = `${diodeLawLabels[l.law]}${l.law === selected ? ' (in use)' : ''}`;
    columns.push(name);
    if (l.law !== 'exponential') columns.push(`Δ ${diodeLawLabels[l.law]}`);
  }

  const row = (
    key: string,
    label: string,
    pick: (law: (typeof laws)[number]) => {
      value: number | null;
      diff: number | null;
      path: string;
    },
  ): ResultRow => {
    const cells: ResultCell[] = [{ text: label }];
    for (const l of laws) {
      const { value, diff, path } = pick(l);
      cells.push({ value, unit: key.startsWith('node') ? 'V' : 'A', path });
      if (l.law !== 'exponential')
        cells.push({ value: diff, unit: '%', path: `${path}.diffPercent`, percent: true });
    }
    return { key, cells };
  };

  const rows: ResultRow[] = [
    ...Object.keys(reference.nodes).map((n) =>
      row(`node-${n}`, `V(${n})`, (l) => ({
        value: l.operatingPoint?.nodes[n] ?? null,
        diff: l.nodeDifferencePercent[n] ?? null,
        path: `comparison.${l.law}.nodes.${n}`,
      })),
    ),
    ...Object.entries(reference.devices).map(([d, op]) =>
      row(`device-${d}`, `${currentLabel(op)}(${show(d)})`, (l) => {
        const dev = l.operatingPoint?.devices[d];
        return {
          value: dev ? mainCurrent(dev) : null,
          diff: l.currentDifferencePercent[d] ?? null,
          path: `comparison.${l.law}.devices.${d}.current`,
        };
      }),
    ),
  ];
  const failed = laws.filter((l) => l.error);

  return (
    <div className="flex flex-col gap-2">
      <ResultTable
        title="Diode-law comparison"
        columns={columns}
        rows={rows}
        note="Each law's bias point; Δ is its difference from the exponential (Shockley) result in %. Transistors keep their full models under every law."
      />
      {failed.map((l) => (
        <p key={l.law} className="text-sm text-fault">
          {diodeLawLabels[l.law]}: no bias point — {l.error?.message}
        </p>
      ))}
    </div>
  );
}
