import { fmt } from '../format.ts';
import { colors, drawText, widthOf } from './layout.ts';

/**
 * Plots drawn as vector paths (moveTo/lineTo), so a record zooms without loss and the numbers
 * behind a curve stay in the page's content stream.
 */

export interface Axis {
  min: number;
  max: number;
  log?: boolean;
  /** e.g. `Junction voltage`. */
  label: string;
  unit: string;
  /** Where the grid lines go; chosen from the range when absent. */
  ticks?: number[];
}

export interface Box {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface Point {
  x: number;
  y: number;
}

export interface LineStyle {
  color: string;
  width?: number;
  dash?: number;
}

/** An axis range that shows the data with a little room, never empty. */
export function rangeOf(
  values: number[],
  options: { includeZero?: boolean } = {},
): [number, number] {
  const finite = values.filter(Number.isFinite);
  if (options.includeZero) finite.push(0);
  if (finite.length === 0) return [0, 1];
  let min = Math.min(...finite);
  let max = Math.max(...finite);
  if (min === max) {
    const pad = Math.abs(min) * 0.1 || 1;
    return [min - pad, max + pad];
  }
  const pad = (max - min) * 0.05;
  if (!(options.includeZero && min === 0)) min -= pad;
  max += pad;
  return [min, max];
}

function niceStep(span: number, count: number): number {
  const raw = span / count;
  const power = 10 ** Math.floor(Math.log10(raw));
  const unit = raw / power;
  const nice = unit < 1.5 ? 1 : unit < 3 ? 2 : unit < 7 ? 5 : 10;
  return nice * power;
}

export function ticks(axis: Axis, count = 5): number[] {
  if (axis.ticks) return axis.ticks;
  if (axis.log) {
    const out: number[] = [];
    for (let k = Math.ceil(Math.log10(axis.min)); k <= Math.floor(Math.log10(axis.max)); k++) {
      out.push(10 ** k);
    }
    return out;
  }
  const step = niceStep(axis.max - axis.min, count);
  const out: number[] = [];
  for (let v = Math.ceil(axis.min / step) * step; v <= axis.max + step * 1e-9; v += step) {
    out.push(Math.abs(v) < step * 1e-9 ? 0 : Number(v.toPrecision(12)));
  }
  return out;
}

const position = (axis: Axis, v: number) =>
  axis.log
    ? (Math.log10(v) - Math.log10(axis.min)) / (Math.log10(axis.max) - Math.log10(axis.min))
    : (v - axis.min) / (axis.max - axis.min);

export function toPage(box: Box, xAxis: Axis, yAxis: Axis, p: Point): Point {
  return {
    x: box.x + position(xAxis, p.x) * box.width,
    y: box.y + box.height - position(yAxis, p.y) * box.height,
  };
}

/** Border, grid, tick labels and axis titles. */
export function drawFrame(doc: PDFKit.PDFDocument, box: Box, xAxis: Axis, yAxis: Axis): void {
  doc.save();
  doc.lineWidth(0.3).strokeColor(colors.rule);
  for (const t of ticks(xAxis)) {
    const { x } = toPage(box, xAxis, yAxis, { x: t, y: yAxis.min });
    doc
      .moveTo(x, box.y)
      .lineTo(x, box.y + box.height)
      .stroke();
    const label = fmt(t, xAxis.unit, 3);
    const w = widthOf(doc, label, { size: 6.5 });
    drawText(doc, label, x - w / 2, box.y + box.height + 2, w + 2, {
      size: 6.5,
      color: colors.muted,
    });
  }
  for (const t of ticks(yAxis)) {
    const { y } = toPage(box, xAxis, yAxis, { x: xAxis.min, y: t });
    doc
      .moveTo(box.x, y)
      .lineTo(box.x + box.width, y)
      .stroke();
    const label = fmt(t, yAxis.unit, 3);
    drawText(doc, label, box.x - 52, y - 4, 49, { size: 6.5, color: colors.muted, align: 'right' });
  }
  doc.lineWidth(0.7).strokeColor(colors.muted).rect(box.x, box.y, box.width, box.height).stroke();
  doc.restore();
  const xTitle = `${xAxis.label} (${xAxis.unit})`;
  const w = widthOf(doc, xTitle, { size: 7.5 });
  drawText(doc, xTitle, box.x + box.width / 2 - w / 2, box.y + box.height + 12, w + 2, {
    size: 7.5,
  });
  drawText(doc, `${yAxis.label} (${yAxis.unit})`, box.x, box.y - 11, box.width, { size: 7.5 });
}

/** A polyline clipped to the plot box; a non-finite point breaks the line. */
export function drawSeries(
  doc: PDFKit.PDFDocument,
  box: Box,
  xAxis: Axis,
  yAxis: Axis,
  points: Point[],
  line: LineStyle,
): void {
  doc.save();
  doc.rect(box.x, box.y, box.width, box.height).clip();
  doc.lineWidth(line.width ?? 1.1).strokeColor(line.color);
  if (line.dash) doc.dash(line.dash, { space: line.dash });
  let open = false;
  for (const p of points) {
    const ok = Number.isFinite(p.x) && Number.isFinite(p.y) && (!xAxis.log || p.x > 0);
    if (!ok) {
      open = false;
      continue;
    }
    const q = toPage(box, xAxis, yAxis, p);
    if (open) doc.lineTo(q.x, q.y);
    else doc.moveTo(q.x, q.y);
    open = true;
  }
  doc.stroke();
  doc.restore();
}

export function drawMarker(
  doc: PDFKit.PDFDocument,
  box: Box,
  xAxis: Axis,
  yAxis: Axis,
  p: Point,
  label: string,
): void {
  if (!Number.isFinite(p.x) || !Number.isFinite(p.y)) return;
  const q = toPage(box, xAxis, yAxis, p);
  doc.save();
  doc.circle(q.x, q.y, 2.6).fillColor(colors.danger).fill();
  doc.restore();
  drawText(doc, label, q.x + 5, q.y - 11, 160, { size: 7, weight: 'bold', color: colors.danger });
}

/** Legend entries under a plot: a short stroke in the series colour, then its name. */
export function drawLegend(
  doc: PDFKit.PDFDocument,
  x: number,
  y: number,
  entries: { label: string; line: LineStyle }[],
): void {
  let cx = x;
  for (const { label, line } of entries) {
    doc.save();
    doc.lineWidth(line.width ?? 1.1).strokeColor(line.color);
    if (line.dash) doc.dash(line.dash, { space: line.dash });
    doc
      .moveTo(cx, y + 4)
      .lineTo(cx + 16, y + 4)
      .stroke();
    doc.restore();
    drawText(doc, label, cx + 20, y, 200, { size: 7 });
    cx += 28 + widthOf(doc, label, { size: 7 });
  }
}
