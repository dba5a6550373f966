import { fontName, latinStandIn, textRuns, type Weight } from './fonts.ts';

/**
 * A small flow layout over pdfkit: a cursor that moves down the page, text that wraps, tables
 * whose rows never split, and a new page whenever the next block would not fit. Sections call
 * these helpers and never place text by hand, so every page keeps the same margins (the header
 * and footer live in the margins, see page-marks.ts).
 */

export const colors = {
  ink: '#1f2933',
  muted: '#52606d',
  rule: '#cbd2d9',
  band: '#eef2f6',
  accent: '#0b4f8a',
  danger: '#b3261e',
  plot: ['#0b4f8a', '#c05621', '#2f855a', '#6b46c1'],
} as const;

export const pageMargins = { top: 70, bottom: 62, left: 50, right: 50 };

export interface Layout {
  doc: PDFKit.PDFDocument;
  /** Left edge of the content, pt. */
  x: number;
  /** Width of the content, pt. */
  width: number;
  top: number;
  /** Lowest y content may reach, pt. */
  bottom: number;
  /** Where the next block starts, pt. */
  y: number;
}

export interface TextStyle {
  /** pt; default 9. */
  size?: number;
  weight?: Weight;
  color?: string;
  align?: 'left' | 'right';
}

const LINE_GAP = 1;

export function createLayout(doc: PDFKit.PDFDocument): Layout {
  const layout: Layout = { doc, x: 0, width: 0, top: 0, bottom: 0, y: 0 };
  resetToPage(layout);
  return layout;
}

function resetToPage(l: Layout): void {
  const { width, height } = l.doc.page;
  l.x = pageMargins.left;
  l.width = width - pageMargins.left - pageMargins.right;
  l.top = pageMargins.top;
  l.bottom = height - pageMargins.bottom;
  l.y = l.top;
}

export function newPage(l: Layout): void {
  l.doc.addPage();
  resetToPage(l);
}

/** Starts a new page unless `height` more points fit on this one; true when it did. */
export function ensureSpace(l: Layout, height: number): boolean {
  if (l.y + height <= l.bottom || l.y === l.top) return false;
  newPage(l);
  return true;
}

export function spacer(l: Layout, height: number): void {
  l.y = Math.min(l.y + height, l.bottom);
}

function style(doc: PDFKit.PDFDocument, s: TextStyle, font: string): void {
  doc
    .font(font)
    .fontSize(s.size ?? 9)
    .fillColor(s.color ?? colors.ink);
}

export function widthOf(doc: PDFKit.PDFDocument, text: string, s: TextStyle = {}): number {
  let total = 0;
  for (const run of textRuns(text, s.weight ?? 'regular')) {
    style(doc, s, run.font);
    total += doc.widthOfString(run.text);
  }
  return total;
}

export function lineHeight(doc: PDFKit.PDFDocument, s: TextStyle = {}): number {
  style(doc, s, fontName('latin', s.weight ?? 'regular'));
  return doc.currentLineHeight(true) + LINE_GAP;
}

/** Height the text takes when wrapped to `width`. */
export function textHeight(
  doc: PDFKit.PDFDocument,
  text: string,
  width: number,
  s: TextStyle = {},
): number {
  if (text === '') return lineHeight(doc, s);
  if (!text.includes('\n') && widthOf(doc, text, s) <= width) return lineHeight(doc, s);
  const weight = s.weight ?? 'regular';
  const runs = textRuns(text, weight);
  const latinOnly = runs.length === 1 && runs[0]!.font === fontName('latin', weight);
  style(doc, s, fontName('latin', weight));
  return doc.heightOfString(latinOnly ? runs[0]!.text : latinStandIn(text), {
    width,
    lineGap: LINE_GAP,
  });
}

/** Draws text at (x, y) wrapped to `width`, each run in the font subset that has its glyphs. */
export function drawText(
  doc: PDFKit.PDFDocument,
  text: string,
  x: number,
  y: number,
  width: number,
  s: TextStyle = {},
): void {
  const runs = textRuns(text, s.weight ?? 'regular');
  if (runs.length === 1) {
    style(doc, s, runs[0]!.font);
    doc.text(runs[0]!.text, x, y, { width, align: s.align ?? 'left', lineGap: LINE_GAP });
    return;
  }
  const total = widthOf(doc, text, s);
  if (!text.includes('\n') && total <= width) {
    let cx = s.align === 'right' ? x + width - total : x;
    for (const run of runs) {
      style(doc, s, run.font);
      doc.text(run.text, cx, y, { lineBreak: false });
      cx += doc.widthOfString(run.text);
    }
    return;
  }
  runs.forEach((run, i) => {
    style(doc, s, run.font);
    const continued = i < runs.length - 1;
    if (i === 0) doc.text(run.text, x, y, { width, continued, lineGap: LINE_GAP });
    else doc.text(run.text, { continued });
  });
}

/** A wrapped paragraph at the cursor (moved to a new page first when it would not fit). */
export function paragraph(
  l: Layout,
  text: string,
  s: TextStyle & { indent?: number; after?: number } = {},
): void {
  const indent = s.indent ?? 0;
  const width = l.width - indent;
  const height = textHeight(l.doc, text, width, s);
  ensureSpace(l, Math.min(height, l.bottom - l.top));
  drawText(l.doc, text, l.x + indent, l.y, width, s);
  l.y += height + (s.after ?? 3);
}

/** A section title; it never sits alone at the bottom of a page. */
export function heading(l: Layout, text: string, level: 1 | 2 = 1): void {
  const size = level === 1 ? 14 : 11;
  ensureSpace(l, 90);
  if (l.y > l.top) spacer(l, level === 1 ? 10 : 6);
  drawText(l.doc, text, l.x, l.y, l.width, { size, weight: 'bold', color: colors.accent });
  l.y += lineHeight(l.doc, { size, weight: 'bold' }) + 2;
  if (level === 1) {
    l.doc
      .moveTo(l.x, l.y)
      .lineTo(l.x + l.width, l.y)
      .lineWidth(0.6)
      .strokeColor(colors.accent)
      .stroke();
    l.y += 5;
  }
}

/** Label: value lines, the labels in a column of their own. */
export function keyValues(l: Layout, pairs: [string, string][], labelWidth = 130): void {
  for (const [label, value] of pairs) {
    const width = l.width - labelWidth;
    const height = Math.max(
      textHeight(l.doc, value, width),
      textHeight(l.doc, label, labelWidth - 6, { weight: 'bold' }),
    );
    ensureSpace(l, height);
    drawText(l.doc, label, l.x, l.y, labelWidth - 6, { weight: 'bold', color: colors.muted });
    drawText(l.doc, value, l.x + labelWidth, l.y, width);
    l.y += height + 2;
  }
}
