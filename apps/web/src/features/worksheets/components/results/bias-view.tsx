import {
  diodeLawLabels,
  type BjtOp,
  type DiodeOp,
  type DraftCircuit,
  type MosfetOp,
  type OperatingPoint,
  type SolvedWorksheet,
} from '@biasproof/calc';
import type { ResultRow } from '@/features/worksheets/components/results/result-csv.ts';
import { ResultNumber } from '@/features/worksheets/components/results/result-cells.tsx';
import { ResultTable } from '@/features/worksheets/components/results/result-table.tsx';
import { regionCell } from '@/features/worksheets/components/results/region-chip.ts';
import { LawComparison } from '@/features/worksheets/components/results/law-comparison.tsx';

const methodLabels: Record<OperatingPoint['method'], string> = {
  plain: 'Newton-Raphson',
  'gmin-stepping': 'Newton-Raphson with gmin stepping',
  'source-stepping': 'Newton-Raphson with source stepping',
  'assumed-state': 'Assumed-state iteration',
};

const num = (value: number, unit: string, path: string) => ({ value, unit, path });

function devicesOf<K extends 'D' | 'Q' | 'M'>(op: OperatingPoint, kind: K) {
  type Op = K extends 'D' ? DiodeOp : K extends 'Q' ? BjtOp : MosfetOp;
  return Object.entries(op.devices).filter((e): e is [string, Op] => e[1].kind === kind);
}

export function BiasView({
  results,
  circuit,
  show,
}: {
  results: SolvedWorksheet;
  circuit: DraftCircuit;
  show: (name: string) => string;
}) {
  const op = results.bias;
  const nodeRows: ResultRow[] = Object.entries(op.nodes).map(([n, v]) => ({
    key: n,
    cells: [{ text: n }, num(v, 'V', `nodes.${n}`)],
  }));

  const diodes = devicesOf(op, 'D');
  const bjts = devicesOf(op, 'Q');
  const mosfets = devicesOf(op, 'M');
  const sources = circuit.elements.filter(
    (el) => el.kind === 'V' || el.kind === 'I' || el.kind === 'E' || el.kind === 'G',
  );
  const passives = circuit.elements.filter(
    (el) => el.kind === 'R' || el.kind === 'C' || el.kind === 'L',
  );
  const el = (name: string) => op.elements[name.toLowerCase()];

  return (
    <div className="flex flex-col gap-6">
      <dl className="grid grid-cols-2 gap-x-4 gap-y-2 rounded-md bg-paper p-3 text-sm sm:grid-cols-4">
        <div>
          <dt className="text-xs font-semibold text-ink-600">Supply power</dt>
          <dd className="font-semibold">
            <ResultNumber value={op.supplyPower} unit="W" path="supplyPower" />
          </dd>
        </div>
        <div>
          <dt className="text-xs font-semibold text-ink-600">Diode law</dt>
          <dd data-result-path="diodeLaw">{diodeLawLabels[op.diodeLaw]}</dd>
        </div>
        <div>
          <dt className="text-xs font-semibold text-ink-600">Converged by</dt>
          <dd data-result-path="method">{methodLabels[op.method]}</dd>
        </div>
        <div>
          <dt className="text-xs font-semibold text-ink-600">
            {op.method === 'assumed-state' ? 'States tried' : 'Iterations'}
          </dt>
          <dd data-result-path="iterations" className="tabular-nums">
            {op.iterations}
          </dd>
        </div>
        <div>
          <dt className="text-xs font-semibold text-ink-600">Largest KCL residual</dt>
          <dd>
            <ResultNumber value={op.residual} unit="A" path="residual" digits={2} />
          </dd>
        </div>
        <div>
          <dt className="text-xs font-semibold text-ink-600">Temperature</dt>
          <dd>
            <ResultNumber value={op.temperature} unit="°C" path="temperature" />
          </dd>
        </div>
      </dl>

      {op.warnings.length > 0 ? (
        <ul className="rounded-md border border-pending bg-pending-tint px-3 py-2 text-sm text-pending">
          {op.warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      ) : null}

      <ResultTable
        title="Node voltages"
        storedCsv="bias"
        columns={['Node', 'Voltage']}
        rows={nodeRows}
        note="Against ground (node 0)."
      />

      {diodes.length > 0 ? (
        <ResultTable
          title="Diodes"
          storedCsv="devices"
          columns={['Diode', 'Region', 'ID', 'VD', 'rd', 'Power']}
          rows={diodes.map(([n, d]) => ({
            key: n,
            cells: [
              { text: show(n) },
              regionCell(n, d),
              num(d.id, 'A', `devices.${n}.id`),
              num(d.vd, 'V', `devices.${n}.vd`),
              num(d.rd, 'Ω', `devices.${n}.rd`),
              num(d.power, 'W', `devices.${n}.power`),
            ],
          }))}
          note="ID flows into the anode; VD is V(anode) − V(cathode)."
        />
      ) : null}
      {bjts.length > 0 ? (
        <ResultTable
          title="Bipolar transistors"
          storedCsv="devices"
          columns={['Transistor', 'Region', 'IC', 'IB', 'VBE', 'VCE', 'β (IC/IB)', 'Power']}
          rows={bjts.map(([n, q]) => ({
            key: n,
            cells: [
              { text: `${show(n)} (${q.polarity})` },
              regionCell(n, q),
              num(q.ic, 'A', `devices.${n}.ic`),
              num(q.ib, 'A', `devices.${n}.ib`),
              num(q.vbe, 'V', `devices.${n}.vbe`),
              num(q.vce, 'V', `devices.${n}.vce`),
              num(q.betaDc, '', `devices.${n}.betaDc`),
              num(q.power, 'W', `devices.${n}.power`),
            ],
          }))}
          note="Terminal currents are positive flowing into the terminal."
        />
      ) : null}
      {mosfets.length > 0 ? (
        <ResultTable
          title="MOSFETs"
          storedCsv="devices"
          columns={['MOSFET', 'Region', 'ID', 'VGS', 'VDS', 'VTH', 'Power']}
          rows={mosfets.map(([n, m]) => ({
            key: n,
            cells: [
              { text: `${show(n)} (${m.polarity})` },
              regionCell(n, m),
              num(m.id, 'A', `devices.${n}.id`),
              num(m.vgs, 'V', `devices.${n}.vgs`),
              num(m.vds, 'V', `devices.${n}.vds`),
              num(m.vth, 'V', `devices.${n}.vth`),
              num(m.power, 'W', `devices.${n}.power`),
            ],
          }))}
        />
      ) : null}
      {sources.length > 0 ? (
        <ResultTable
          title="Sources"
          storedCsv="bias"
          columns={['Source', 'Current', 'Power absorbed']}
          rows={sources.map((s) => {
            const n = s.name.toLowerCase();
            const current =
              s.kind === 'V' || s.kind === 'E' ? (op.sources[n] ?? 0) : (el(n)?.current ?? 0);
            const path =
              s.kind === 'V' || s.kind === 'E' ? `sources.${n}` : `elements.${n}.current`;
            return {
              key: n,
              cells: [
                { text: s.name },
                num(current, 'A', path),
                num(el(n)?.power ?? 0, 'W', `elements.${n}.power`),
              ],
            };
          })}
          note="As SPICE reports it: a voltage source's current is positive flowing into its + terminal, so a supply delivering power shows a negative current and negative absorbed power."
        />
      ) : null}
      {passives.length > 0 ? (
        <ResultTable
          title="Resistors, capacitors and inductors"
          storedCsv="bias"
          columns={['Element', 'Current', 'Power']}
          rows={passives.map((p) => {
            const n = p.name.toLowerCase();
            return {
              key: n,
              cells: [
                { text: p.name },
                num(el(n)?.current ?? 0, 'A', `elements.${n}.current`),
                num(el(n)?.power ?? 0, 'W', `elements.${n}.power`),
              ],
            };
          })}
          note="Current flows from the first node to the second."
        />
      ) : null}

      {results.comparison ? (
        <LawComparison comparison={results.comparison} selected={op.diodeLaw} show={show} />
      ) : null}
    </div>
  );
}
