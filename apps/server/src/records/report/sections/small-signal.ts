import {
  isMissing,
  type DeviceSmallSignal,
  type Missing,
  type Outcome,
  type SolvedWorksheet,
} from '@biasproof/calc';
import { fmt, fmtPhasor } from '../../format.ts';
import type { ReportContext } from '../context.ts';
import { colors, heading, keyValues, paragraph, type Layout } from '../layout.ts';
import { table } from '../table.ts';
import { displayName } from './bias.ts';

const right = (header: string, share = 1) => ({ header, share, align: 'right' as const });

/** The value of an outcome, or a line saying why there is none. */
function unwrap<T>(l: Layout, outcome: Outcome<T> | Missing, what: string): T | null {
  if (outcome.ok) return outcome.value;
  if (isMissing(outcome)) paragraph(l, `No ${what}: ${outcome.missing}`, { color: colors.muted });
  else paragraph(l, `No ${what}: ${outcome.error.message}`, { color: colors.danger });
  return null;
}

function deviceRow(name: string, d: DeviceSmallSignal): string[] {
  if (d.kind === 'D')
    return [name, 'Diode', '—', `rd ${fmt(d.rd, 'Ω')}`, `rs ${fmt(d.rs, 'Ω')}`, '—'];
  if (d.kind === 'Q')
    return [
      name,
      'BJT',
      fmt(d.gm, 'S'),
      `rπ ${fmt(d.rpi, 'Ω')}`,
      fmt(d.ro, 'Ω'),
      fmt(d.betaAc, ''),
    ];
  return [name, 'MOSFET', fmt(d.gm, 'S'), `gmb ${fmt(d.gmb, 'S')}`, fmt(d.ro, 'Ω'), '—'];
}

function signalSize(l: Layout, ctx: ReportContext, results: SolvedWorksheet): void {
  heading(l, 'Signal size', 2);
  const s = unwrap(l, results.signalSize, 'signal-size check');
  if (!s) return;
  const { circuit, settings } = ctx.data.revision.draft;
  const input = circuit.elements.find(
    (e) => e.name.toLowerCase() === settings.inputSource.toLowerCase(),
  );
  const currentDriven = input?.kind === 'I';
  keyValues(l, [
    ['Input amplitude (peak)', fmt(s.amplitude, currentDriven ? 'A' : 'V')],
    ['Linear gain at midband', fmt(s.linearGain, currentDriven ? 'Ω' : 'V/V')],
    ['Linear output peak', fmt(s.linearPeak, 'V')],
    [
      'Exact output excursion',
      `${fmt(s.exactPositive, 'V')} at the positive peak, ${fmt(s.exactNegative, 'V')} at the negative`,
    ],
    ['Linearity error', `${fmt(s.errorPercent, '%', 3)} (limit ${fmt(s.errorLimit, '%', 3)})`],
    ['Second harmonic', fmt(s.secondHarmonicPercent, '%', 3)],
    [
      'Verdict',
      s.pass
        ? 'Small enough for the small-signal model'
        : 'Too large: the small-signal results do not hold at this amplitude',
    ],
  ]);
  if (s.ports.length) {
    table(
      l,
      [
        { header: 'Device', share: 1 },
        { header: 'Port', share: 0.7 },
        right('Swing'),
        right('Scale'),
        right('Swing/scale'),
        right('Error estimate'),
        { header: 'Within common practice', share: 1.3 },
      ],
      s.ports.map((p) => [
        displayName(ctx, p.device),
        p.port,
        fmt(p.swing, 'V'),
        fmt(p.scale, 'V'),
        fmt(p.ratio, '', 3),
        fmt(p.estimatedErrorPercent, '%', 3),
        p.withinCommonPractice ? 'yes' : 'no',
      ]),
      { note: 'Common practice: a junction swing well under N·VT (ratio ≤ 0.2).' },
    );
  }
}

export function smallSignalSection(l: Layout, ctx: ReportContext): void {
  const results = ctx.data.revision.results;
  if (results.status !== 'solved') return;
  heading(l, 'Small-signal parameters, gain and impedances');
  heading(l, 'Device parameters at the bias point', 2);
  const devices = unwrap(l, results.devices, 'device parameters');
  if (devices && Object.keys(devices).length > 0) {
    table(
      l,
      [
        { header: 'Device', share: 1 },
        { header: 'Type', share: 1 },
        right('gm'),
        right('Input side', 1.4),
        right('ro / rs', 1.2),
        right('βac', 0.8),
      ],
      Object.entries(devices).map(([n, d]) => deviceRow(displayName(ctx, n), d)),
      { note: 'rπ, rd and ro in Ω, gm and gmb in S, at the full-model bias point.' },
    );
  } else if (devices) {
    paragraph(l, 'The circuit has no diodes or transistors.', { color: colors.muted });
  }
  heading(l, 'Gain and impedances', 2);
  const ss = unwrap(l, results.smallSignal, 'gain or impedances');
  if (ss) {
    keyValues(l, [
      ['Frequency', fmt(ss.frequency, 'Hz')],
      ['Gain', `${fmtPhasor(ss.gain, ss.gainUnit)} (${fmt(ss.gain.db, 'dB')})`],
      ['Input impedance', fmtPhasor(ss.zin, 'Ω')],
      ['Output impedance', fmtPhasor(ss.zout, 'Ω')],
      [
        'Input and output',
        `${ctx.data.revision.draft.settings.inputSource} to node ${ctx.data.revision.draft.settings.outputNode}`,
      ],
    ]);
  }
  signalSize(l, ctx, results);
}
