import {
  diodeLawLabels,
  type BjtOp,
  type DiodeOp,
  type MosfetOp,
  type OperatingPoint,
  type SolvedWorksheet,
} from '@biasproof/calc';
import { fmt } from '../../format.ts';
import type { ReportContext } from '../context.ts';
import { colors, heading, keyValues, paragraph, type Layout } from '../layout.ts';
import { table } from '../table.ts';

const methodLabels: Record<OperatingPoint['method'], string> = {
  plain: 'Newton-Raphson',
  'gmin-stepping': 'Newton-Raphson with gmin stepping',
  'source-stepping': 'Newton-Raphson with source stepping',
  'assumed-state': 'Assumed-state iteration',
};

const right = (header: string, share = 1) => ({ header, share, align: 'right' as const });

function devicesOf<T extends DiodeOp | BjtOp | MosfetOp>(
  op: OperatingPoint,
  kind: T['kind'],
): [string, T][] {
  return Object.entries(op.devices).filter((e): e is [string, T] => e[1].kind === kind);
}

/** The circuit's display name of a lowercase result name (`q1` → `Q1`). */
export function displayName(ctx: ReportContext, name: string): string {
  return (
    ctx.data.revision.draft.circuit.elements.find((el) => el.name.toLowerCase() === name)?.name ??
    name
  );
}

function deviceTables(l: Layout, ctx: ReportContext, op: OperatingPoint): void {
  const show = (n: string) => displayName(ctx, n);
  const diodes = devicesOf<DiodeOp>(op, 'D');
  if (diodes.length) {
    heading(l, 'Diodes', 2);
    table(
      l,
      [
        { header: 'Diode', share: 1 },
        { header: 'Region', share: 1 },
        right('ID'),
        right('VD'),
        right('rd'),
        right('Power'),
      ],
      diodes.map(([n, d]) => [
        show(n),
        d.region,
        fmt(d.id, 'A'),
        fmt(d.vd, 'V'),
        fmt(d.rd, 'Ω'),
        fmt(d.power, 'W'),
      ]),
      { note: 'ID flows into the anode; VD is V(anode) − V(cathode).' },
    );
  }
  const bjts = devicesOf<BjtOp>(op, 'Q');
  if (bjts.length) {
    heading(l, 'Bipolar transistors', 2);
    table(
      l,
      [
        { header: 'Transistor', share: 1.3 },
        { header: 'Region', share: 1.2 },
        right('IC'),
        right('IB'),
        right('VBE'),
        right('VCE'),
        right('β (IC/IB)'),
        right('Power'),
      ],
      bjts.map(([n, q]) => [
        `${show(n)} (${q.polarity})`,
        q.region,
        fmt(q.ic, 'A'),
        fmt(q.ib, 'A'),
        fmt(q.vbe, 'V'),
        fmt(q.vce, 'V'),
        fmt(q.betaDc, ''),
        fmt(q.power, 'W'),
      ]),
      { note: 'Terminal currents are positive flowing into the terminal.' },
    );
  }
  const mosfets = devicesOf<MosfetOp>(op, 'M');
  if (mosfets.length) {
    heading(l, 'MOSFETs', 2);
    table(
      l,
      [
        { header: 'MOSFET', share: 1.3 },
        { header: 'Region', share: 1.1 },
        right('ID'),
        right('VGS'),
        right('VDS'),
        right('VTH'),
        right('Power'),
      ],
      mosfets.map(([n, m]) => [
        `${show(n)} (${m.polarity})`,
        m.region,
        fmt(m.id, 'A'),
        fmt(m.vgs, 'V'),
        fmt(m.vds, 'V'),
        fmt(m.vth, 'V'),
        fmt(m.power, 'W'),
      ]),
    );
  }
}

function elementTables(l: Layout, ctx: ReportContext, op: OperatingPoint): void {
  const elements = ctx.data.revision.draft.circuit.elements;
  const el = (name: string) => op.elements[name.toLowerCase()];
  const sources = elements.filter(
    (e) => e.kind === 'V' || e.kind === 'I' || e.kind === 'E' || e.kind === 'G',
  );
  if (sources.length) {
    heading(l, 'Sources', 2);
    table(
      l,
      [{ header: 'Source', share: 2 }, right('Current', 1.5), right('Power absorbed', 1.5)],
      sources.map((s) => {
        const n = s.name.toLowerCase();
        const current =
          s.kind === 'V' || s.kind === 'E' ? (op.sources[n] ?? 0) : (el(n)?.current ?? 0);
        return [s.name, fmt(current, 'A'), fmt(el(n)?.power ?? 0, 'W')];
      }),
      {
        note: "As SPICE reports it: a voltage source's current is positive into its + terminal, so a supply delivering power shows negative current and power.",
      },
    );
  }
  const passives = elements.filter((e) => e.kind === 'R' || e.kind === 'C' || e.kind === 'L');
  if (passives.length) {
    heading(l, 'Resistors, capacitors and inductors', 2);
    table(
      l,
      [{ header: 'Element', share: 2 }, right('Current', 1.5), right('Power', 1.5)],
      passives.map((p) => [
        p.name,
        fmt(el(p.name)?.current ?? 0, 'A'),
        fmt(el(p.name)?.power ?? 0, 'W'),
      ]),
    );
  }
}

function lawComparison(l: Layout, results: SolvedWorksheet): void {
  const c = results.comparison;
  if (!c) return;
  heading(l, 'Diode laws compared', 2);
  if (!c.ok) {
    paragraph(l, `The comparison could not be made: ${c.error.message}`, { color: colors.danger });
    return;
  }
  const largest = (r: Record<string, number | null>) => {
    const values = Object.values(r)
      .filter((v): v is number => v !== null)
      .map(Math.abs);
    return values.length ? fmt(Math.max(...values), '%', 3) : '—';
  };
  table(
    l,
    [
      { header: 'Law', share: 2 },
      { header: 'Solved', share: 2 },
      right('Largest node difference', 1.5),
      right('Largest current difference', 1.5),
    ],
    c.value.laws.map((law) => [
      diodeLawLabels[law.law],
      law.error ? `no: ${law.error.message}` : 'yes',
      law.error ? '—' : largest(law.nodeDifferencePercent),
      law.error ? '—' : largest(law.currentDifferencePercent),
    ]),
    { note: 'Differences are relative to the exponential (Shockley) law.' },
  );
}

export function biasSection(l: Layout, ctx: ReportContext): void {
  heading(l, 'Bias point');
  const results = ctx.data.revision.results;
  if (results.status === 'empty') {
    paragraph(l, 'The circuit is empty: there is nothing to solve.');
    return;
  }
  if (results.status === 'failed') {
    paragraph(
      l,
      `The engine could not find a bias point: ${results.error.message} (${results.error.code}).`,
      {
        color: colors.danger,
      },
    );
    return;
  }
  const op = results.bias;
  keyValues(l, [
    ['Supply power', fmt(op.supplyPower, 'W')],
    ['Diode law', diodeLawLabels[op.diodeLaw]],
    ['Converged by', methodLabels[op.method]],
    [op.method === 'assumed-state' ? 'States tried' : 'Iterations', String(op.iterations)],
    ['Largest KCL residual', fmt(op.residual, 'A', 2)],
    ['Temperature', fmt(op.temperature, '°C')],
  ]);
  for (const w of op.warnings) paragraph(l, `Warning: ${w}`, { color: colors.danger });
  heading(l, 'Node voltages', 2);
  table(
    l,
    [{ header: 'Node', share: 2 }, right('Voltage', 1.5)],
    Object.entries(op.nodes).map(([n, v]) => [n, fmt(v, 'V')]),
    { note: 'Against ground (node 0).' },
  );
  deviceTables(l, ctx, op);
  elementTables(l, ctx, op);
  lawComparison(l, results);
}
