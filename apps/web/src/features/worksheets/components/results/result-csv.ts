/**
 * Result tables as CSV for a spreadsheet: numbers at full precision in SI units (the unit goes
 * into the column heading when the whole column shares one), text as shown.
 */

export type ResultCell =
  | { text: string }
  | { value: number | null; unit: string; path: string; digits?: number; percent?: boolean }
  | { chip: string; tone: 'ok' | 'caution' | 'neutral' | 'fault'; path?: string; title?: string };

export interface ResultRow {
  key: string;
  cells: ResultCell[];
}

function quote(text: string): string {
  return /[",\n\r]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

function rawNumber(value: number | null): string {
  if (value === null) return '';
  if (Number.isNaN(value)) return 'NaN';
  if (!Number.isFinite(value)) return value > 0 ? 'Infinity' : '-Infinity';
  return String(value);
}

export function toCsv(columns: readonly string[], rows: readonly ResultRow[]): string {
  const unitsOf = columns.map((_, c) => {
    const units = new Set<string>();
    for (const row of rows) {
      const cell = row.cells[c];
      if (cell && 'value' in cell) units.add(cell.unit);
    }
    return units;
  });
  const heading = columns.map((label, c) => {
    const units = unitsOf[c]!;
    const [unit] = [...units];
    return units.size === 1 && unit ? `${label} (${unit})` : label;
  });
  const lines = [heading.map(quote).join(',')];
  for (const row of rows) {
    const cells = row.cells.map((cell, c) => {
      if ('text' in cell) return cell.text;
      if ('chip' in cell) return cell.chip;
      const number = rawNumber(cell.value);
      return unitsOf[c]!.size === 1 || number === '' || cell.unit === ''
        ? number
        : `${number} ${cell.unit}`;
    });
    lines.push(cells.map(quote).join(','));
  }
  return `${lines.join('\r\n')}\r\n`;
}
