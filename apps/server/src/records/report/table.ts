import {
  colors,
  drawText,
  ensureSpace,
  lineHeight,
  newPage,
  spacer,
  textHeight,
  type Layout,
} from './layout.ts';

export interface Column {
  header: string;
  /** Share of the content width (the shares of a table need not add up to 1; they are scaled). */
  share: number;
  /** Numbers read best right-aligned. */
  align?: 'left' | 'right';
}

export interface TableOptions {
  /** pt; default 8. */
  size?: number;
  /** A line under the table (units, sign conventions). */
  note?: string;
}

const PAD_X = 3;
const PAD_Y = 2.5;

function columnGeometry(l: Layout, columns: Column[]): { x: number; width: number }[] {
  const total = columns.reduce((sum, c) => sum + c.share, 0);
  let x = l.x;
  return columns.map((c) => {
    const width = (c.share / total) * l.width;
    const cell = { x, width };
    x += width;
    return cell;
  });
}

function rowHeight(
  l: Layout,
  cells: string[],
  geometry: { width: number }[],
  size: number,
  bold: boolean,
) {
  let height = lineHeight(l.doc, { size });
  cells.forEach((text, i) => {
    const width = geometry[i]!.width - 2 * PAD_X;
    height = Math.max(
      height,
      textHeight(l.doc, text, width, { size, weight: bold ? 'bold' : 'regular' }),
    );
  });
  return height + 2 * PAD_Y;
}

function drawRow(
  l: Layout,
  cells: string[],
  columns: Column[],
  geometry: { x: number; width: number }[],
  size: number,
  header: boolean,
  height: number,
): void {
  if (header) {
    l.doc.rect(l.x, l.y, l.width, height).fillColor(colors.band).fill();
  }
  cells.forEach((text, i) => {
    const { x, width } = geometry[i]!;
    drawText(l.doc, text, x + PAD_X, l.y + PAD_Y, width - 2 * PAD_X, {
      size,
      weight: header ? 'bold' : 'regular',
      color: header ? colors.muted : colors.ink,
      align: columns[i]!.align ?? 'left',
    });
  });
  l.y += height;
  l.doc
    .moveTo(l.x, l.y)
    .lineTo(l.x + l.width, l.y)
    .lineWidth(0.3)
    .strokeColor(colors.rule)
    .stroke();
}

/** A table whose rows never split across pages; the header row repeats on every page it spans. */
export function table(
  l: Layout,
  columns: Column[],
  rows: string[][],
  options: TableOptions = {},
): void {
  const size = options.size ?? 8;
  const geometry = columnGeometry(l, columns);
  const headers = columns.map((c) => c.header);
  const headerHeight = rowHeight(l, headers, geometry, size, true);
  const first = rows[0] ? rowHeight(l, rows[0], geometry, size, false) : 0;
  ensureSpace(l, headerHeight + first);
  drawRow(l, headers, columns, geometry, size, true, headerHeight);
  for (const row of rows) {
    const height = rowHeight(l, row, geometry, size, false);
    if (l.y + height > l.bottom) {
      newPage(l);
      drawRow(l, headers, columns, geometry, size, true, headerHeight);
    }
    drawRow(l, row, columns, geometry, size, false, height);
  }
  if (options.note) {
    spacer(l, 2);
    const height = textHeight(l.doc, options.note, l.width, { size: 7.5 });
    ensureSpace(l, height);
    drawText(l.doc, options.note, l.x, l.y, l.width, { size: 7.5, color: colors.muted });
    l.y += height;
  }
  spacer(l, 8);
}
