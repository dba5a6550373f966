import { formatValue } from '@biasproof/calc';
import type { Finding } from '@biasproof/shared';

export const severityLabels: Record<Finding['severity'], string> = {
  note: 'Note',
  minor: 'Minor',
  major: 'Major',
};

export const statusLabels: Record<Finding['status'], string> = {
  open: 'Open',
  answered: 'Answered',
  closed: 'Closed',
};

export const replyKindLabels: Record<Finding['replies'][number]['kind'], string> = {
  answer: 'Answered',
  close: 'Closed',
  reopen: 'Reopened',
  reply: 'Replied',
};

/** Workflow states in words (the state names of the brief). */
export const stateWords: Record<string, string> = {
  draft: 'Draft',
  in_check: 'In check',
  checked: 'Checked',
  signed_off: 'Signed off',
  returned: 'Returned',
  withdrawn: 'Withdrawn',
  superseded: 'Superseded',
};

// The unit of a number follows from the last part of its result path (see the worksheets
// README's list of paths); anything not listed is shown without a unit.
const unitBySuffix: [RegExp, string][] = [
  [/(^|\.)nodes\.[^.]+$/, 'V'],
  [/^sources\.[^.]+$/, 'A'],
  [/\.(id|ic|ib|current|i)$/, 'A'],
  [
    /\.(vd|vj|vbe|vce|vgs|vds|vth|v|voltage|swing|amplitude|linearPeak|exactPositive|exactNegative)$/,
    'V',
  ],
  [/\.(rd|rs|rpi|ro|ohm|resistance)$/, 'Ω'],
  [/\.(gm|gmb|slope)$/, 'S'],
  [/(^supplyPower|\.power)$/, 'W'],
  [/Hz$/, 'Hz'],
  [/\.(db|midbandDb)$/, 'dB'],
  [/\.deg$/, '°'],
  [/Percent$/, '%'],
];

export function unitOfPath(path: string): string {
  return unitBySuffix.find(([pattern]) => pattern.test(path))?.[1] ?? '';
}

/** A pinned or current number as a person reads it, with SI prefix and the path's unit. */
export function formatPinned(value: number | string | null, path: string): string {
  if (value === null) return '—';
  if (typeof value === 'string') return value;
  const unit = unitOfPath(path);
  if (unit === '%' || unit === 'dB' || unit === '°')
    return `${Number(value.toPrecision(4))} ${unit}`;
  return formatValue(value, unit);
}

export function shortHash(hash: string): string {
  return hash.slice(0, 12);
}

export function fileSize(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(1)} kB`;
  return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
}

/**
 * The element showing a result path, if the results show it now. Paths hold letters, digits,
 * `_`, `$`, `-` and dots only (findingPathSchema), so they sit safely in a quoted selector.
 */
export function resultNumberAt(path: string): HTMLElement | null {
  if (!/^[\w$.-]+$/.test(path)) return null;
  return document.querySelector<HTMLElement>(`[data-result-path="${path}"]`);
}
