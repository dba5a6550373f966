/**
 * CSV as RFC 4180 writes it (CRLF line ends; a field with a comma, quote or line break is
 * quoted, quotes doubled), with a UTF-8 byte order mark so spreadsheet programs read Ω and µ
 * in the headings as UTF-8 rather than a legacy code page.
 */

/** A number (written at full precision, as JavaScript prints it), text, or nothing. */
export type CsvValue = string | number | null | undefined;

/**
 * Text a spreadsheet would run as a formula when the file is opened (CSV injection): a field
 * starting with =, +, - or @ (or a tab or carriage return, which some programs skip first).
 * Such text gets a leading apostrophe, which spreadsheets show as a text marker and which
 * cannot start a formula. Numbers are exempt: we write them ourselves, and a negative
 * reading must stay a number.
 */
const formulaStart = /^[=+\-@\t\r]/;

export function csvField(value: CsvValue): string {
  if (value === null || value === undefined) return '';
  let text: string;
  if (typeof value === 'number') {
    text = Number.isNaN(value)
      ? 'NaN'
      : Number.isFinite(value)
        ? String(value)
        : value > 0
          ? 'Infinity'
          : '-Infinity';
  } else {
    text = formulaStart.test(value) ? `'${value}` : value;
  }
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export const BOM = '\uFEFF';

export function toCsv(header: string[], rows: CsvValue[][]): string {
  const lines = [header, ...rows].map((row) => row.map(csvField).join(','));
  return `${BOM}${lines.join('\r\n')}\r\n`;
}
