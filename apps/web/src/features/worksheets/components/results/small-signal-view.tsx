import {
  formatValue,
  isMissing,
  type DeviceSmallSignal,
  type SolvedWorksheet,
} from '@biasproof/calc';
import { LazyBodePlot } from '@/features/worksheets/components/plots/lazy-plots.tsx';
import { EngineErrorNotice } from '@/features/worksheets/components/results/engine-error-notice.tsx';
import { MissingSetting } from '@/features/worksheets/components/results/missing-setting.tsx';
import type { ResultRow } from '@/features/worksheets/components/results/result-csv.ts';
import { ResultTable } from '@/features/worksheets/components/results/result-table.tsx';

const num = (value: number | null, unit: string, path: string) => ({ value, unit, path });

function deviceRows<K extends DeviceSmallSignal['kind']>(
  devices: Record<string, DeviceSmallSignal>,
  kind: K,
) {
  return Object.entries(devices).filter(
    (e): e is [string, Extract<DeviceSmallSignal, { kind: K }>] => e[1].kind === kind,
  );
}

function DeviceParameters({
  devices,
  show,
}: {
  devices: Record<string, DeviceSmallSignal>;
  show: (n: string) => string;
}) {
  const p = (n: string, q: string) => `smallSignal.devices.${n}.${q}`;
  const diodes = deviceRows(devices, 'D');
  const bjts = deviceRows(devices, 'Q');
  const mosfets = deviceRows(devices, 'M');
  if (diodes.length + bjts.length + mosfets.length === 0) {
    return (
      <p className="text-sm text-ink-600">
        No diodes or transistors: the circuit is linear as drawn.
      </p>
    );
  }
  return (
    <>
      {diodes.length > 0 ? (
        <ResultTable
          title="Diode parameters at Q"
          storedCsv="devices"
          columns={['Diode', 'rd', 'RS']}
          rows={diodes.map(([n, d]) => ({
            key: n,
            cells: [{ text: show(n) }, num(d.rd, 'Ω', p(n, 'rd')), num(d.rs, 'Ω', p(n, 'rs'))],
          }))}
        />
      ) : null}
      {bjts.length > 0 ? (
        <ResultTable
          title="Bipolar transistor parameters at Q"
          storedCsv="devices"
          columns={['Transistor', 'gm', 'rπ', 'ro', 'β (ac)']}
          rows={bjts.map(([n, q]) => ({
            key: n,
            cells: [
              { text: show(n) },
              num(q.gm, 'S', p(n, 'gm')),
              num(q.rpi, 'Ω', p(n, 'rpi')),
              num(q.ro, 'Ω', p(n, 'ro')),
              num(q.betaAc, '', p(n, 'beta')),
            ],
          }))}
        />
      ) : null}
      {mosfets.length > 0 ? (
        <ResultTable
          title="MOSFET parameters at Q"
          storedCsv="devices"
          columns={['MOSFET', 'gm', 'gmb', 'ro']}
          rows={mosfets.map(([n, m]) => ({
            key: n,
            cells: [
              { text: show(n) },
              num(m.gm, 'S', p(n, 'gm')),
              num(m.gmb, 'S', p(n, 'gmb')),
              num(m.ro, 'Ω', p(n, 'ro')),
            ],
          }))}
        />
      ) : null}
    </>
  );
}

export function SmallSignalView({
  results,
  show,
}: {
  results: SolvedWorksheet;
  show: (n: string) => string;
}) {
  const { devices, smallSignal, sweep } = results;
  let figures = null;
  if (isMissing(smallSignal)) figures = <MissingSetting>{smallSignal.missing}</MissingSetting>;
  else if (!smallSignal.ok)
    figures = (
      <EngineErrorNotice
        title="Gain and impedances could not be computed"
        error={smallSignal.error}
        show={show}
      />
    );
  else {
    const s = smallSignal.value;
    const rows: ResultRow[] = [
      {
        key: 'gain',
        cells: [
          { text: 'Gain' },
          num(s.gain.mag, s.gainUnit, 'gain.vv'),
          num(s.gain.db, 'dB', 'gain.db'),
          num(s.gain.deg, '°', 'gain.deg'),
        ],
      },
      {
        key: 'zin',
        cells: [
          { text: 'Input impedance Zin' },
          num(s.zin.mag, 'Ω', 'zin.ohm'),
          { text: '' },
          num(s.zin.deg, '°', 'zin.deg'),
        ],
      },
      {
        key: 'zout',
        cells: [
          { text: 'Output impedance Zout' },
          num(s.zout.mag, 'Ω', 'zout.ohm'),
          { text: '' },
          num(s.zout.deg, '°', 'zout.deg'),
        ],
      },
    ];
    figures = (
      <ResultTable
        title={`At ${formatValue(s.frequency, 'Hz')}`}
        storedCsv="small-signal"
        columns={['Quantity', 'Magnitude', 'dB', 'Phase']}
        rows={rows}
        note="Zin is what the input source sees; Zout is seen at the output node with the input source zeroed."
      />
    );
  }

  let response = null;
  if (isMissing(sweep)) response = null;
  else if (!sweep.ok)
    response = (
      <EngineErrorNotice title="The frequency sweep failed" error={sweep.error} show={show} />
    );
  else {
    const w = sweep.value;
    response = (
      <>
        <ResultTable
          title="Frequency response"
          storedCsv="sweep"
          columns={['Quantity', 'Value']}
          rows={[
            {
              key: 'mid',
              cells: [{ text: 'Midband gain' }, num(w.midbandDb, 'dB', 'sweep.midbandDb')],
            },
            {
              key: 'low',
              cells: [
                { text: 'Lower −3 dB corner' },
                num(w.lowCornerHz, 'Hz', 'sweep.lowCornerHz'),
              ],
            },
            {
              key: 'high',
              cells: [
                { text: 'Upper −3 dB corner' },
                num(w.highCornerHz, 'Hz', 'sweep.highCornerHz'),
              ],
            },
          ]}
          note="— means the response does not fall 3 dB below midband within the sweep."
        />
        <LazyBodePlot
          sweep={w}
          analysisFrequency={
            isMissing(smallSignal) || !smallSignal.ok ? -1 : smallSignal.value.frequency
          }
        />
      </>
    );
  }

  return (
    <div className="flex flex-col gap-6">
      <p className="text-xs text-ink-600">
        Linearized at the bias point of the full device models (exponential diode law), whatever law
        the bias view uses.
      </p>
      {figures}
      {response}
      {devices.ok ? (
        <DeviceParameters devices={devices.value} show={show} />
      ) : (
        <EngineErrorNotice
          title="Device parameters could not be computed"
          error={devices.error}
          show={show}
        />
      )}
    </div>
  );
}
