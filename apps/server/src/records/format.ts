import { formatValue } from '@biasproof/calc';

/**
 * How a record writes numbers and times for people. Everything here is a pure function of
 * its input, so the same revision always prints the same text.
 */

/** Units that read as plain numbers (0.005969 V/V, not 5.969 mV/V), as the worksheet view shows them. */
const plainUnits = new Set(['', 'V/V', 'A/A']);

function plainNumber(x: number, digits: number): string {
  if (x === 0) return '0';
  const abs = Math.abs(x);
  if (abs >= 1e-3 && abs < 1e6) return String(Number(x.toPrecision(digits)));
  const [m = '', e = ''] = x.toExponential(digits - 1).split('e');
  return `${Number(m)}e${Number(e)}`;
}

/**
 * A result with SI prefix and unit (`936 µA`, `4.7 kΩ`), 4 significant digits by default.
 * Non-finite values are written out in words: the embedded font subsets have no ∞ glyph, and
 * "infinite" cannot be misread.
 */
export function fmt(value: number | null | undefined, unit: string, digits = 4): string {
  if (value === null || value === undefined) return '—';
  if (Number.isNaN(value)) return 'not a number';
  if (!Number.isFinite(value)) return value > 0 ? 'infinite' : '-infinite';
  if (plainUnits.has(unit)) {
    const text = plainNumber(value, digits);
    return unit === '' ? text : `${text} ${unit}`;
  }
  return formatValue(value, unit, { digits });
}

/** A complex quantity as magnitude and phase. */
export function fmtPhasor(z: { mag: number; deg: number }, unit: string): string {
  return `${fmt(z.mag, unit)} at ${fmt(z.deg, '°', 3)}`;
}

const formatters = new Map<string, Intl.DateTimeFormat>();

function formatterFor(zone: string): Intl.DateTimeFormat {
  let f = formatters.get(zone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-GB', {
      timeZone: zone,
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
      hour: '2-digit',
      minute: '2-digit',
      second: '2-digit',
      hourCycle: 'h23',
    });
    formatters.set(zone, f);
  }
  return f;
}

/** A zone the runtime knows, else UTC (an organization's stored zone is validated, but a record must still print). */
export function knownZone(zone: string): string {
  try {
    formatterFor(zone);
    return zone;
  } catch {
    return 'UTC';
  }
}

/**
 * A date-time in the organization's time zone with its UTC offset, e.g.
 * `2026-12-01 23:45:12 +01:00`; the offset makes the instant unambiguous across zones and
 * daylight-saving changes.
 */
export function fmtTime(at: string | Date, zone: string): string {
  const date = typeof at === 'string' ? new Date(at) : at;
  const tz = knownZone(zone);
  const parts: Record<string, string> = {};
  for (const p of formatterFor(tz).formatToParts(date)) parts[p.type] = p.value;
  const y = Number(parts.year);
  const wall = Date.UTC(
    y,
    Number(parts.month) - 1,
    Number(parts.day),
    Number(parts.hour),
    Number(parts.minute),
    Number(parts.second),
  );
  const offsetMinutes = Math.round((wall - Math.floor(date.getTime() / 1000) * 1000) / 60_000);
  const sign = offsetMinutes < 0 ? '-' : '+';
  const abs = Math.abs(offsetMinutes);
  const offset = `${sign}${String(Math.floor(abs / 60)).padStart(2, '0')}:${String(abs % 60).padStart(2, '0')}`;
  return `${parts.year}-${parts.month}-${parts.day} ${parts.hour}:${parts.minute}:${parts.second} ${offset}`;
}

/** Lower-case, dash-separated, at most 60 characters: safe in a download's file name. */
export function fileSafe(s: string): string {
  return (
    s
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .slice(0, 60) || 'worksheet'
  );
}

/** `ab-12-bias-divider-rev-a` */
export function recordBaseName(projectCode: string, title: string, letter: string): string {
  return `${fileSafe(projectCode)}-${fileSafe(title)}-rev-${letter.toLowerCase()}`;
}
