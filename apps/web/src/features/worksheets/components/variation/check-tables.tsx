import type {
  HandCheck,
  HandCheckResult,
  Limit,
  LimitCheck,
  LimitReport,
  LimitYield,
} from '@biasproof/calc';
import type { ReactNode } from 'react';
import { Button } from '@/components/ui/button.tsx';
import { ResultNumber } from '@/features/worksheets/components/results/result-cells.tsx';
import {
  formatPercentDifference,
  formatResult,
} from '@/features/worksheets/components/results/result-format.ts';
import { StatusChip } from '@/features/worksheets/components/variation/status-chip.tsx';
import { tableCell, tableHead } from '@/features/worksheets/components/variation/table-cells.tsx';
import { unitOfPath } from '@/features/worksheets/components/variation/variation-targets.ts';

/** Tables of the limits and hand checks with their pass/fail chips, margins and deviations. */

function signed(value: number, unit: string): string {
  const text = formatResult(Math.abs(value), unit);
  return value > 0 ? `+${text}` : value < 0 ? `−${text}` : text;
}

/** A result path's key among the rows: the path, numbered when it appears more than once. */
export function rowKeys(paths: readonly string[]): string[] {
  const seen = new Map<string, number>();
  return paths.map((p) => {
    const n = (seen.get(p) ?? 0) + 1;
    seen.set(p, n);
    return n === 1 ? p : `${p}#${n}`;
  });
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

function Actions({
  what,
  onEdit,
  onDelete,
}: {
  what: string;
  onEdit: () => void;
  onDelete: () => void;
}) {
  return (
    <td className={`${tableCell} whitespace-nowrap text-right`}>
      <Button size="sm" variant="quiet" aria-label={`Edit ${what}`} onClick={onEdit}>
        Edit
      </Button>
      <Button size="sm" variant="quiet" aria-label={`Delete ${what}`} onClick={onDelete}>
        Delete
      </Button>
    </td>
  );
}

function Table({
  caption,
  columns,
  children,
}: {
  caption: string;
  columns: string[];
  children: ReactNode;
}) {
  return (
    <div className="overflow-x-auto rounded-md border border-rule">
      <table className="w-full border-collapse">
        <caption className="sr-only">{caption}</caption>
        <thead className="bg-paper">
          <tr>
            {columns.map((c, i) => (
              <th key={i} scope="col" className={tableHead}>
                {c || <span className="sr-only">Actions</span>}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>{children}</tbody>
      </table>
    </div>
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
    <Table caption={`Limits (${limits.length})`} columns={readOnly ? columns : [...columns, '']}>
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
              <Actions
                what={`the limit on ${limit.path}`}
                onEdit={() => onEdit(i)}
                onDelete={() => onDelete(i)}
              />
            )}
          </tr>
        );
      })}
    </Table>
  );
}

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
    <Table
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
              <Actions
                what={`the hand check of ${check.path}`}
                onEdit={() => onEdit(i)}
                onDelete={() => onDelete(i)}
              />
            )}
          </tr>
        );
      })}
    </Table>
  );
}
