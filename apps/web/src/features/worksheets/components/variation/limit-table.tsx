import type { Limit, LimitCheck, LimitReport, LimitYield } from '@biasproof/calc';
import { ResultNumber } from '@/features/worksheets/components/results/result-cells.tsx';
import {
  formatPercentDifference,
  formatResult,
} from '@/features/worksheets/components/results/result-format.ts';
import { StatusChip } from '@/features/worksheets/components/variation/status-chip.tsx';
import {
  CheckActions,
  CheckTable,
  rowKeys,
} from '@/features/worksheets/components/variation/check-table-parts.tsx';
import { tableCell } from '@/features/worksheets/components/variation/table-cells.tsx';

/** The limits: pass/fail with margins at nominal and at the worst corner, and the yield. */

function signed(value: number, unit: string): string {
  const text = formatResult(Math.abs(value), unit);
  return value > 0 ? `+${text}` : value < 0 ? `−${text}` : text;
}

export function limitText(l: Pick<Limit, 'min' | 'max' | 'unit'>): string {
  const f = (x: number) => formatResult(x, l.unit);
  if (l.min !== undefined && l.max !== undefined) return `${f(l.min)} to ${f(l.max)}`;
  return l.min !== undefined ? `≥ ${f(l.min)}` : `≤ ${f(l.max!)}`;
}

function CheckCell({ check, path, suffix }: { check: LimitCheck; path: string; suffix?: string }) {
  if (check.value === null)
    return (
      <StatusChip status="fail" path={path} title="The result could not be computed">
        no value
      </StatusChip>
    );
  const percent =
    check.marginPercent === null ? '' : ` (${formatPercentDifference(check.marginPercent)})`;
  return (
    <span className="flex flex-col items-start gap-1">
      <ResultNumber value={check.value} unit={check.unit} path={`${path}.value`} />
      <StatusChip status={check.pass ? 'pass' : 'fail'} path={path}>
        margin {signed(check.margin ?? 0, check.unit)}
        {percent}
        {suffix ? `, ${suffix}` : ''}
      </StatusChip>
    </span>
  );
}

export function LimitTable({
  limits,
  reports,
  yields,
  samples,
  readOnly,
  onEdit,
  onDelete,
}: {
  limits: readonly Limit[];
  /** The computed report of each limit, or null while the results catch up with the draft. */
  reports: (LimitReport | null)[];
  /** Monte Carlo yield of each limit, or null without a run. */
  yields: (LimitYield | null)[];
  samples: number | null;
  readOnly: boolean;
  onEdit: (index: number) => void;
  onDelete: (index: number) => void;
}) {
  const keys = rowKeys(limits.map((l) => l.path));
  const columns = ['Result', 'Limit', 'At nominal', 'Worst corner', 'Monte Carlo yield'];
  return (
    <CheckTable
      caption={`Limits (${limits.length})`}
      columns={readOnly ? columns : [...columns, '']}
    >
      {limits.map((limit, i) => {
        const base = `variation.limits.${keys[i]}`;
        const report = reports[i];
        const corner = report?.worstCorner;
        const y = yields[i];
        return (
          <tr key={keys[i]} className="border-t border-rule">
            <th scope="row" className={`${tableCell} text-left font-mono font-semibold`}>
              {limit.path}
            </th>
            <td className={tableCell}>{limitText(limit)}</td>
            <td className={tableCell}>
              {report ? <CheckCell check={report.nominal} path={`${base}.nominal`} /> : 'Updating…'}
            </td>
            <td className={tableCell}>
              {corner ? (
                <CheckCell
                  check={corner}
                  path={`${base}.worstCorner`}
                  suffix={corner.at ? `at the ${corner.at} corner` : undefined}
                />
              ) : (
                <span className="text-ink-600">— (no toleranced parameters)</span>
              )}
            </td>
            <td className={tableCell}>
              {y && samples !== null ? (
                <>
                  <ResultNumber value={y.fraction * 100} unit="%" path={`${base}.yield`} />{' '}
                  <span className="text-xs text-ink-600">
                    ({y.passed} of {samples})
                  </span>
                </>
              ) : (
                <span className="text-ink-600">— (no Monte Carlo run)</span>
              )}
            </td>
            {readOnly ? null : (
              <CheckActions
                what={`the limit on ${limit.path}`}
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
