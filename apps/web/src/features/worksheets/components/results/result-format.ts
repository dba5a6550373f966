import { formatValue } from '@biasproof/calc';

/** Units shown without an SI prefix: ratios read as plain numbers (0.005969 V/V, not 5.969 mV/V). */
const plainUnits = new Set(['', 'V/V', 'A/A', '×']);

function plainNumber(x: number, digits: number): string {
  if (x === 0) return '0';
  const abs = Math.abs(x);
  if (abs >= 1e-3 && abs < 1e6) return String(Number(x.toPrecision(digits)));
  const [m = '', e = ''] = x.toExponential(digits - 1).split('e');
  return `${Number(m)}e${Number(e)}`;
}

/** A result for people: SI prefix and unit, 4 significant digits; `—` when there is none. */
export function formatResult(value: number | null, unit: string, digits = 4): string {
  if (value === null) return '—';
  if (!plainUnits.has(unit) || !Number.isFinite(value)) return formatValue(value, unit, { digits });
  const text = plainNumber(value, digits);
  return unit === '' ? text : `${text} ${unit}`;
}

/** A signed percentage difference: `+0.154 %`, `−16.09 %`. */
export function formatPercentDifference(value: number | null): string {
  if (value === null) return '—';
  const text = formatValue(Math.abs(value), '%', { digits: 3 });
  if (value === 0) return text;
  return `${value > 0 ? '+' : '−'}${text}`;
}
