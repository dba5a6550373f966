import { LazyLoadLinePlot } from '@/features/worksheets/components/plots/lazy-plots.tsx';
import { EngineErrorNotice } from '@/features/worksheets/components/results/engine-error-notice.tsx';
import { ResultTable } from '@/features/worksheets/components/results/result-table.tsx';
import type { SolvedWorksheet } from '@biasproof/calc';

/** The graphical bias check of each diode and each BJT's base-emitter junction. */
export function LoadLineView({
  results,
  show,
}: {
  results: SolvedWorksheet;
  show: (n: string) => string;
}) {
  if (results.loadLines.length === 0) {
    return (
      <p className="text-sm text-ink-600">
        Load lines are drawn for diodes and bipolar transistors; this circuit has neither.
      </p>
    );
  }
  return (
    <div className="flex flex-col gap-8">
      {results.loadLines.map(({ device, result }) => {
        if (!result.ok) {
          return (
            <EngineErrorNotice
              key={device}
              title={`No load line for ${show(device)}`}
              error={result.error}
              show={show}
            />
          );
        }
        const p = result.value;
        const base = `loadLine.${device}`;
        const iUnit = 'A';
        return (
          <section
            key={device}
            aria-label={`Load line of ${show(device)}`}
            className="flex flex-col gap-3 border-t border-rule pt-4 first:border-t-0 first:pt-0"
          >
            <h3 className="text-base font-bold text-ink-900">
              {show(device)} — {p.junction === 'BE' ? 'base-emitter junction' : 'diode junction'}
            </h3>
            <LazyLoadLinePlot picture={p} deviceName={show(device)} />
            <ResultTable
              title={`${show(device)}: Q-point and load line`}
              columns={['Quantity', 'Value']}
              rows={[
                {
                  key: 'vq',
                  cells: [
                    { text: 'Q-point voltage' },
                    { value: p.q.v, unit: 'V', path: `${base}.q.v` },
                  ],
                },
                {
                  key: 'iq',
                  cells: [
                    { text: 'Q-point current' },
                    { value: p.q.i, unit: iUnit, path: `${base}.q.i` },
                  ],
                },
                {
                  key: 'vth',
                  cells: [
                    { text: 'Thevenin voltage of the rest' },
                    { value: p.thevenin.voltage, unit: 'V', path: `${base}.thevenin.voltage` },
                  ],
                },
                {
                  key: 'rth',
                  cells: [
                    { text: 'Thevenin resistance of the rest' },
                    {
                      value: p.thevenin.resistance,
                      unit: 'Ω',
                      path: `${base}.thevenin.resistance`,
                    },
                  ],
                },
                {
                  key: 'slope',
                  cells: [
                    { text: p.junction === 'BE' ? 'Tangent slope 1/rπ' : 'Tangent slope 1/rd' },
                    { value: p.slope, unit: 'S', path: `${base}.slope` },
                  ],
                },
              ]}
              note={
                p.junction === 'BE'
                  ? 'Current is the base current; an emitter resistance appears multiplied by (β + 1).'
                  : undefined
              }
            />
          </section>
        );
      })}
    </div>
  );
}
