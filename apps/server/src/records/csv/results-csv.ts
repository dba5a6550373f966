import {
  isMissing,
  type DeviceOp,
  type DeviceSmallSignal,
  type SolvedWorksheet,
} from '@biasproof/calc';
import type { ResultTable } from '@biasproof/shared';
import { AppError } from '../../errors/app-error.ts';
import type { RecordData } from '../record-data.ts';
import { toCsv, type CsvValue } from './csv.ts';

const unavailable = (what: string, why: string) =>
  new AppError('unprocessable', `This revision has no ${what}: ${why}`);

function solved(data: RecordData): SolvedWorksheet {
  const r = data.revision.results;
  if (r.status === 'solved') return r;
  throw unavailable(
    'results',
    r.status === 'empty' ? 'the circuit is empty.' : `the engine failed (${r.error.message}).`,
  );
}

/** Node voltages, then every element's current and absorbed power, then the supply power. */
function biasRows(results: SolvedWorksheet): CsvValue[][] {
  const op = results.bias;
  const rows: CsvValue[][] = Object.entries(op.nodes).map(([n, v]) => ['node', n, v, null, null]);
  for (const [name, e] of Object.entries(op.elements)) {
    rows.push(['element', name, null, op.sources[name] ?? e.current, e.power]);
  }
  rows.push(['circuit', 'supply', null, null, op.supplyPower]);
  return rows;
}

function deviceRow(name: string, op: DeviceOp, ss: DeviceSmallSignal | undefined): CsvValue[] {
  const common = [name, op.kind, 'polarity' in op ? op.polarity : null, op.region];
  if (op.kind === 'D') {
    const rd = ss?.kind === 'D' ? ss.rd : op.rd;
    return [
      ...common,
      op.id,
      null,
      op.vd,
      null,
      null,
      op.power,
      null,
      null,
      rd,
      null,
      null,
      op.rs,
      null,
      null,
    ];
  }
  if (op.kind === 'Q') {
    return [
      ...common,
      op.ic,
      op.ib,
      op.vbe,
      op.vce,
      null,
      op.power,
      op.gm,
      null,
      null,
      op.rpi,
      op.ro,
      null,
      op.betaDc,
      op.betaAc,
    ];
  }
  return [
    ...common,
    op.id,
    null,
    op.vgs,
    op.vds,
    op.vth,
    op.power,
    op.gm,
    op.gmb,
    null,
    null,
    op.ro,
    null,
    null,
    null,
  ];
}

const deviceHeader = [
  'Device',
  'Type',
  'Polarity',
  'Region',
  'ID or IC (A)',
  'IB (A)',
  'VD, VBE or VGS (V)',
  'VCE or VDS (V)',
  'VTH (V)',
  'Power (W)',
  'gm (S)',
  'gmb (S)',
  'rd (Ω)',
  'rπ (Ω)',
  'ro (Ω)',
  'rs (Ω)',
  'β DC',
  'β AC',
];

export function resultsCsv(data: RecordData, table: ResultTable): string {
  const results = solved(data);
  switch (table) {
    case 'bias':
      return toCsv(['Kind', 'Name', 'Voltage (V)', 'Current (A)', 'Power (W)'], biasRows(results));
    case 'devices': {
      const ss = results.devices.ok ? results.devices.value : {};
      const rows = Object.entries(results.bias.devices).map(([n, op]) => deviceRow(n, op, ss[n]));
      return toCsv(deviceHeader, rows);
    }
    case 'small-signal': {
      const s = results.smallSignal;
      if (!s.ok)
        throw unavailable('gain or impedances', isMissing(s) ? s.missing : s.error.message);
      const f = s.value;
      const header = [
        'Quantity',
        'Frequency (Hz)',
        'Unit',
        'Magnitude',
        'Phase (deg)',
        'Real',
        'Imaginary',
        'dB',
      ];
      return toCsv(header, [
        ['gain', f.frequency, f.gainUnit, f.gain.mag, f.gain.deg, f.gain.re, f.gain.im, f.gain.db],
        ['input impedance', f.frequency, 'Ω', f.zin.mag, f.zin.deg, f.zin.re, f.zin.im, null],
        ['output impedance', f.frequency, 'Ω', f.zout.mag, f.zout.deg, f.zout.re, f.zout.im, null],
      ]);
    }
    case 'sweep': {
      const s = results.sweep;
      if (!s.ok) throw unavailable('frequency sweep', isMissing(s) ? s.missing : s.error.message);
      const { freq, db, deg } = s.value;
      return toCsv(
        ['Frequency (Hz)', 'Magnitude (dB)', 'Phase (deg)'],
        freq.map((f, i) => [f, db[i], deg[i]]),
      );
    }
  }
}
