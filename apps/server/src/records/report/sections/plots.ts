import type { LoadLineResult, SweepFigures } from '@biasproof/calc';
import { fmt } from '../../format.ts';
import type { ReportContext } from '../context.ts';
import {
  colors,
  ensureSpace,
  heading,
  keyValues,
  paragraph,
  spacer,
  type Layout,
} from '../layout.ts';
import {
  drawFrame,
  drawLegend,
  drawMarker,
  drawSeries,
  rangeOf,
  type Axis,
  type Box,
  type LineStyle,
} from '../plot.ts';
import { displayName } from './bias.ts';

const PLOT_HEIGHT = 190;
/** Room left of a plot for the tick labels. */
const GUTTER = 56;

function plotBox(l: Layout, height: number): Box {
  return { x: l.x + GUTTER, y: l.y + 14, width: l.width - GUTTER - 6, height };
}

function loadLinePlot(l: Layout, ctx: ReportContext, r: LoadLineResult): void {
  const name = displayName(ctx, r.device);
  // Keep the heading with its plot.
  ensureSpace(l, PLOT_HEIGHT + 130);
  heading(l, `Load line of ${name}`, 2);
  const box = plotBox(l, PLOT_HEIGHT);
  // The same window as the worksheet view: the sampled voltages, and currents up to 1.3 times
  // the larger of Q and the load line's current intercept (the curve itself runs far higher).
  const xmin = r.curve[0]?.v ?? 0;
  const xmax = r.curve[r.curve.length - 1]?.v ?? 1;
  const ymin = 0;
  const ymax = 1.3 * Math.max(r.q.i, r.loadLine[1].i, 1e-12);
  const current = r.junction === 'BE' ? 'Base current' : 'Diode current';
  const xAxis: Axis = {
    min: xmin,
    max: xmax,
    label: r.junction === 'BE' ? 'VBE' : 'Junction voltage',
    unit: 'V',
  };
  const yAxis: Axis = { min: ymin, max: ymax, label: current, unit: 'A' };
  const curve: LineStyle = { color: colors.plot[0] };
  const load: LineStyle = { color: colors.plot[1] };
  const tangent: LineStyle = { color: colors.plot[2], width: 0.8, dash: 3 };
  drawFrame(l.doc, box, xAxis, yAxis);
  const pts = (list: { v: number; i: number }[]) => list.map((p) => ({ x: p.v, y: p.i }));
  drawSeries(l.doc, box, xAxis, yAxis, pts(r.curve), curve);
  drawSeries(l.doc, box, xAxis, yAxis, pts(r.loadLine), load);
  drawSeries(l.doc, box, xAxis, yAxis, pts(r.tangent), tangent);
  drawMarker(l.doc, box, xAxis, yAxis, { x: r.q.v, y: r.q.i }, 'Q');
  l.y = box.y + box.height + 26;
  drawLegend(l.doc, box.x, l.y, [
    { label: 'device curve', line: curve },
    { label: 'load line', line: load },
    { label: 'tangent at Q', line: tangent },
  ]);
  l.y += 14;
  keyValues(l, [
    ['Q-point', `${fmt(r.q.v, 'V')}, ${fmt(r.q.i, 'A')}`],
    [
      'Thevenin of the rest',
      `${fmt(r.thevenin.voltage, 'V')} behind ${fmt(r.thevenin.resistance, 'Ω')}`,
    ],
    [
      'Slope at Q',
      `${fmt(r.slope, 'S')} (${r.junction === 'BE' ? 'rπ' : 'rd'} = ${fmt(1 / r.slope, 'Ω')})`,
    ],
  ]);
}

function bodePlot(l: Layout, sweep: SweepFigures): void {
  const panel = 150;
  ensureSpace(l, 2 * panel + 130);
  heading(l, 'Frequency response (Bode plot)', 2);
  const xAxis: Axis = {
    min: sweep.freq[0] ?? 1,
    max: sweep.freq[sweep.freq.length - 1] ?? 10,
    log: true,
    label: 'Frequency',
    unit: 'Hz',
  };
  if (xAxis.max <= xAxis.min) xAxis.max = xAxis.min * 10;
  const mag = plotBox(l, panel);
  const [dbMin, dbMax] = rangeOf(sweep.db);
  const dbAxis: Axis = { min: dbMin, max: dbMax, label: 'Magnitude', unit: 'dB' };
  drawFrame(l.doc, mag, xAxis, dbAxis);
  const magLine: LineStyle = { color: colors.plot[0] };
  drawSeries(
    l.doc,
    mag,
    xAxis,
    dbAxis,
    sweep.freq.map((f, i) => ({ x: f, y: sweep.db[i]! })),
    magLine,
  );
  const corner: LineStyle = { color: colors.danger, width: 0.6, dash: 2 };
  const guide = (f: number | null) => {
    if (f !== null)
      drawSeries(
        l.doc,
        mag,
        xAxis,
        dbAxis,
        [
          { x: f, y: dbMin },
          { x: f, y: dbMax },
        ],
        corner,
      );
  };
  guide(sweep.lowCornerHz);
  guide(sweep.highCornerHz);
  drawSeries(
    l.doc,
    mag,
    xAxis,
    dbAxis,
    [
      { x: xAxis.min, y: sweep.midbandDb - 3.0103 },
      { x: xAxis.max, y: sweep.midbandDb - 3.0103 },
    ],
    corner,
  );

  l.y = mag.y + mag.height + 24;
  const phase = plotBox(l, panel * 0.8);
  const phaseAxis: Axis = {
    min: -180,
    max: 180,
    label: 'Phase',
    unit: '°',
    ticks: [-180, -90, 0, 90, 180],
  };
  drawFrame(l.doc, phase, xAxis, phaseAxis);
  // The phase is reported in (−180°, 180°]: a wrap is a jump of the reading, not of the
  // response, so the line breaks there instead of crossing the panel.
  const phasePoints = sweep.freq.flatMap((f, i) => {
    const wrapped = i > 0 && Math.abs(sweep.deg[i]! - sweep.deg[i - 1]!) > 180;
    return [...(wrapped ? [{ x: f, y: Number.NaN }] : []), { x: f, y: sweep.deg[i]! }];
  });
  drawSeries(l.doc, phase, xAxis, phaseAxis, phasePoints, { color: colors.plot[1] });
  l.y = phase.y + phase.height + 26;
  drawLegend(l.doc, phase.x, l.y, [
    { label: 'magnitude', line: magLine },
    { label: 'phase', line: { color: colors.plot[1] } },
    { label: 'midband − 3 dB and corners', line: corner },
  ]);
  l.y += 14;
  keyValues(l, [
    ['Midband gain', fmt(sweep.midbandDb, 'dB')],
    [
      'Low corner (−3 dB)',
      sweep.lowCornerHz === null ? 'not within the sweep' : fmt(sweep.lowCornerHz, 'Hz'),
    ],
    [
      'High corner (−3 dB)',
      sweep.highCornerHz === null ? 'not within the sweep' : fmt(sweep.highCornerHz, 'Hz'),
    ],
    ['Points', String(sweep.freq.length)],
  ]);
}

export function plotsSection(l: Layout, ctx: ReportContext): void {
  const results = ctx.data.revision.results;
  if (results.status !== 'solved') return;
  heading(l, 'Load lines and frequency response');
  if (results.loadLines.length === 0) {
    paragraph(l, 'The circuit has no diode or bipolar transistor: no load line to draw.', {
      color: colors.muted,
    });
  }
  for (const { device, result } of results.loadLines) {
    if (result.ok) loadLinePlot(l, ctx, result.value);
    else
      paragraph(l, `No load line for ${displayName(ctx, device)}: ${result.error.message}`, {
        color: colors.danger,
      });
    spacer(l, 6);
  }
  if (results.sweep.ok) bodePlot(l, results.sweep.value);
  else if ('missing' in results.sweep)
    paragraph(l, `No frequency response: ${results.sweep.missing}`, { color: colors.muted });
  else
    paragraph(l, `No frequency response: ${results.sweep.error.message}`, { color: colors.danger });
}
