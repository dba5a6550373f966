import { diodeLawLabels } from '@biasproof/calc';
import { fmt } from '../../format.ts';
import type { ReportContext } from '../context.ts';
import { heading, keyValues, type Layout } from '../layout.ts';
import { flatten } from './generic.ts';

const known = new Set([
  'diodeLaw',
  'constantDrop',
  'piecewiseLinear',
  'temperature',
  'inputSource',
  'outputNode',
  'sweep',
  'frequency',
  'amplitude',
  'errorLimit',
]);

export function settingsSection(l: Layout, ctx: ReportContext): void {
  const s = ctx.data.revision.draft.settings;
  const { circuit } = ctx.data.revision.draft;
  const input = circuit.elements.find(
    (el) => el.name.toLowerCase() === s.inputSource.toLowerCase(),
  );
  const signalUnit = input?.kind === 'I' ? 'A' : 'V';
  heading(l, 'Analysis settings');
  const rows: [string, string][] = [
    ['Diode law', diodeLawLabels[s.diodeLaw]],
    ['Constant drop', fmt(s.constantDrop.vOn, 'V')],
    [
      'Piecewise-linear law',
      `knee ${fmt(s.piecewiseLinear.v0, 'V')}, slope ${fmt(s.piecewiseLinear.rd, 'Ω')}`,
    ],
    ['Temperature', fmt(s.temperature, '°C')],
    ['Input source', s.inputSource || 'not chosen'],
    ['Output node', s.outputNode || 'not chosen'],
    [
      'Frequency sweep',
      `${s.sweep.type}, ${s.sweep.points} points${s.sweep.type === 'lin' ? '' : ` per ${s.sweep.type === 'dec' ? 'decade' : 'octave'}`}, ${fmt(s.sweep.fstart, 'Hz')} to ${fmt(s.sweep.fstop, 'Hz')}`,
    ],
    ['Small-signal frequency', fmt(s.frequency, 'Hz')],
    ['Signal amplitude (peak)', fmt(s.amplitude, signalUnit)],
    ['Linearity error limit', fmt(s.errorLimit, '%')],
  ];
  const extra = Object.fromEntries(Object.entries(s).filter(([k]) => !known.has(k)));
  if (Object.keys(extra).length > 0) rows.push(...flatten(extra, '').rows);
  keyValues(l, rows, 150);
}
