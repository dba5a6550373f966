import type { HandCheck, HandCheckResult } from '@biasproof/calc';
import { ResultNumber } from '@/features/worksheets/components/results/result-cells.tsx';
import {
  formatPercentDifference,
  formatResult,
} from '@/features/worksheets/components/results/result-format.ts';
import {
  CheckActions,
  CheckTable,
  rowKeys,
} from '@/features/worksheets/components/variation/check-table-parts.tsx';
import { StatusChip } from '@/features/worksheets/components/variation/status-chip.tsx';
import { tableCell } from '@/features/worksheets/components/variation/table-cells.tsx';
import { unitOfPath } from '@/features/worksheets/components/variation/variation-targets.ts';

/** The author's hand-calculated values beside the engine's: deviation in % and pass or fail. */
export function HandCheckTable({
  checks,
  results,
  readOnly,
  onEdit,
  onDelete,
}: {
  checks: readonly HandCheck[];
  results: (HandCheckResult | null)[];
  readOnly: boolean;
  onEdit: (index: number) => void;
  onDelete: (index: number) => void;
}) {
  const keys = rowKeys(checks.map((c) => c.path));
  const columns = ['Result', 'Expected', 'Engine', 'Deviation', 'Note'];
  return (
    <CheckTable
      caption={`Hand-calc checks (${checks.length})`}
      columns={readOnly ? columns : [...columns, '']}
    >
      {checks.map((check, i) => {
        const base = `variation.handChecks.${keys[i]}`;
        const r = results[i];
        const unit = unitOfPath(check.path);
        return (
          <tr key={keys[i]} className="border-t border-rule">
            <th scope="row" className={`${tableCell} text-left font-mono font-semibold`}>
              {check.path}
            </th>
            <td className={tableCell}>{formatResult(check.expected, unit)}</td>
            <td className={tableCell}>
              {r ? (
                <ResultNumber value={r.actual} unit={unit} path={`${base}.actual`} />
              ) : (
                'Updating…'
              )}
            </td>
            <td className={tableCell}>
              {r ? (
                <StatusChip
                  status={r.pass ? 'pass' : 'fail'}
                  path={`${base}.deviation`}
                  title={`Accepted: ±${check.tolerancePercent} %`}
                >
                  {r.deviationPercent === null
                    ? 'no value'
                    : formatPercentDifference(r.deviationPercent)}{' '}
                  (±{check.tolerancePercent} %)
                </StatusChip>
              ) : null}
            </td>
            <td className={`${tableCell} text-ink-700`}>{check.note}</td>
            {readOnly ? null : (
              <CheckActions
                what={`the hand check of ${check.path}`}
                onEdit={() => onEdit(i)}
                onDelete={() => onDelete(i)}
              />
            )}
          </tr>
        );
      })}
    </CheckTable>
  );
}
