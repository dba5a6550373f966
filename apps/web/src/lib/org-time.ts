// Dates are stored in UTC and shown in the organization's time zone, written the same way
// everywhere a record is read (signatures, history, audit log): `2026-12-02 14:05 Europe/Berlin
// (GMT+01:00)`, unambiguous whatever the reader's language.

const formats = new Map<string, Intl.DateTimeFormat>();

function formatFor(timeZone: string): Intl.DateTimeFormat {
  let format = formats.get(timeZone);
  if (!format) {
    format = new Intl.DateTimeFormat('en-GB', {
      timeZone,
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
      hour: '2-digit',
      minute: '2-digit',
      hourCycle: 'h23',
      timeZoneName: 'longOffset',
    });
    formats.set(timeZone, format);
  }
  return format;
}

/** `2026-12-02 14:05 Europe/Berlin (GMT+01:00)`; an unknown zone falls back to UTC. */
export function formatInZone(iso: string | Date, timeZone: string): string {
  const date = typeof iso === 'string' ? new Date(iso) : iso;
  if (Number.isNaN(date.getTime())) return String(iso);
  let zone = timeZone;
  let parts: Intl.DateTimeFormatPart[];
  try {
    parts = formatFor(zone).formatToParts(date);
  } catch {
    zone = 'UTC';
    parts = formatFor(zone).formatToParts(date);
  }
  const part = (type: Intl.DateTimeFormatPartTypes) =>
    parts.find((p) => p.type === type)?.value ?? '';
  const offset = part('timeZoneName') === 'GMT' ? 'GMT+00:00' : part('timeZoneName');
  return `${part('year')}-${part('month')}-${part('day')} ${part('hour')}:${part('minute')} ${zone} (${offset})`;
}
