import type { AuditEvent } from '@biasproof/shared';

/**
 * A spreadsheet treats a cell that starts with one of these as a formula, so an exported value
 * chosen by someone else (a user agent, a project name, a finding's text) could run a formula
 * (e.g. `=HYPERLINK(…)` or DDE) on the machine of the manager who opens the file. A leading
 * apostrophe makes the spreadsheet show the text as text (OWASP "CSV injection"). Tab and
 * carriage return are on OWASP's list too.
 */
const FORMULA_START = /^[=+\-@\t\r]/;

/** One cell per RFC 4180: quoted when it holds a comma, quote or line break; quotes doubled. */
export function csvCell(value: string | null): string {
  if (value === null) return '';
  const safe = FORMULA_START.test(value) ? `'${value}` : value;
  return /[",\r\n]/.test(safe) ? `"${safe.replaceAll('"', '""')}"` : safe;
}

const columns: [header: string, value: (e: AuditEvent) => string | null][] = [
  ['at', (e) => e.at],
  ['actor', (e) => e.actor?.name ?? null],
  ['actorId', (e) => e.actor?.id ?? null],
  ['action', (e) => e.action],
  ['summary', (e) => e.summary],
  ['targetType', (e) => e.targetType],
  ['targetId', (e) => e.targetId],
  ['projectId', (e) => e.projectId],
  ['worksheetId', (e) => e.worksheetId],
  ['revision', (e) => e.revision],
  ['ip', (e) => e.ip],
  ['userAgent', (e) => e.userAgent],
  ['details', (e) => JSON.stringify(e.details)],
  ['eventId', (e) => e.id],
];

/**
 * The events as CSV (RFC 4180: CRLF line ends, a header row). It starts with a UTF-8 byte
 * order mark, without which common spreadsheets read names like "Jürgen" as Latin-1.
 */
export function auditCsv(events: readonly AuditEvent[]): string {
  const lines = [
    columns.map(([header]) => header).join(','),
    ...events.map((e) => columns.map(([, value]) => csvCell(value(e))).join(',')),
  ];
  return `\uFEFF${lines.join('\r\n')}\r\n`;
}
