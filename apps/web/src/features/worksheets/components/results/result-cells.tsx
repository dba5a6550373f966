import type { ReactNode } from 'react';
import type { ResultCell } from '@/features/worksheets/components/results/result-csv.ts';
import { MarkedResult } from '@/features/worksheets/components/results/result-marks.tsx';
import {
  formatPercentDifference,
  formatResult,
} from '@/features/worksheets/components/results/result-format.ts';

const chipTones = {
  ok: 'bg-ok-tint text-ok border-ok',
  caution: 'bg-pending-tint text-pending border-pending',
  neutral: 'bg-paper text-ink-700 border-ink-300',
  fault: 'bg-fault-tint text-fault border-fault',
} as const;

export function Chip({
  tone,
  children,
  path,
  title,
}: {
  tone: keyof typeof chipTones;
  children: ReactNode;
  path?: string;
  title?: string;
}) {
  return (
    <MarkedResult
      path={path}
      title={title}
      className={`inline-block rounded-full border px-2 py-0.5 text-xs font-semibold ${chipTones[tone]}`}
    >
      {children}
    </MarkedResult>
  );
}

/** A number with its unit and its result path (what a reviewer pins a finding to). */
export function ResultNumber({
  value,
  unit,
  path,
  digits,
  percent,
}: {
  value: number | null;
  unit: string;
  path: string;
  digits?: number;
  percent?: boolean;
}) {
  const text = percent ? formatPercentDifference(value) : formatResult(value, unit, digits);
  return (
    <MarkedResult
      path={path}
      title={value === null ? undefined : `${value} ${unit}`.trim()}
      className="tabular-nums"
    >
      {text}
    </MarkedResult>
  );
}

export function CellContent({ cell }: { cell: ResultCell }) {
  if ('text' in cell) return <>{cell.text}</>;
  if ('chip' in cell) {
    return (
      <Chip tone={cell.tone} path={cell.path} title={cell.title}>
        {cell.chip}
      </Chip>
    );
  }
  return <ResultNumber {...cell} />;
}
