import { Chip } from '@/features/worksheets/components/results/result-cells.tsx';
import { formatResult } from '@/features/worksheets/components/results/result-format.ts';
import { EngineErrorNotice } from '@/features/worksheets/components/results/engine-error-notice.tsx';
import { MissingSetting } from '@/features/worksheets/components/results/missing-setting.tsx';
import { ResultTable } from '@/features/worksheets/components/results/result-table.tsx';
import { isMissing, type SolvedWorksheet } from '@biasproof/calc';

const num = (value: number, unit: string, path: string, percent = false) => ({
  value,
  unit,
  path,
  percent,
});
const portLabels = {
  D: 'junction',
  BE: 'base-emitter',
  BC: 'base-collector',
  GS: 'gate-source',
} as const;

/** Is the stated signal small enough for the small-signal model? Exact against linear. */
export function SignalSizeView({
  results,
  show,
  unit,
}: {
  results: SolvedWorksheet;
  show: (n: string) => string;
  unit: 'V' | 'A';
}) {
  const check = results.signalSize;
  if (isMissing(check)) return <MissingSetting>{check.missing}</MissingSetting>;
  if (!check.ok)
    return (
      <EngineErrorNotice
        title="The signal-size check could not be made"
        error={check.error}
        show={show}
      />
    );
  const s = check.value;
  const outUnit = 'V';
  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-wrap items-center gap-3">
        <Chip tone={s.pass ? 'ok' : 'fault'} path="signalSize.pass">
          {s.pass ? 'Pass' : 'Fail'}
        </Chip>
        <p className="text-sm text-ink-900">
          Linearity error {formatResult(s.errorPercent, '%')} against a limit of{' '}
          {formatResult(s.errorLimit, '%')} for a peak input of {formatResult(s.amplitude, unit)}.
        </p>
      </div>
      <ResultTable
        title="Linear against exact response"
        columns={['Quantity', 'Value']}
        rows={[
          {
            key: 'amp',
            cells: [
              { text: 'Input amplitude (peak)' },
              num(s.amplitude, unit, 'signalSize.amplitude'),
            ],
          },
          {
            key: 'gain',
            cells: [
              { text: 'Midband gain' },
              num(s.linearGain, unit === 'V' ? 'V/V' : 'Ω', 'signalSize.linearGain'),
            ],
          },
          {
            key: 'lin',
            cells: [
              { text: 'Linear output peak' },
              num(s.linearPeak, outUnit, 'signalSize.linearPeak'),
            ],
          },
          {
            key: 'pos',
            cells: [
              { text: 'Exact output swing, + peak' },
              num(s.exactPositive, outUnit, 'signalSize.exactPositive'),
            ],
          },
          {
            key: 'neg',
            cells: [
              { text: 'Exact output swing, − peak' },
              num(s.exactNegative, outUnit, 'signalSize.exactNegative'),
            ],
          },
          {
            key: 'err',
            cells: [
              { text: 'Linearity error' },
              num(s.errorPercent, '%', 'signalSize.errorPercent'),
            ],
          },
          {
            key: 'limit',
            cells: [{ text: 'Error limit' }, num(s.errorLimit, '%', 'signalSize.errorLimit')],
          },
          {
            key: 'h2',
            cells: [
              { text: 'Second harmonic' },
              num(s.secondHarmonicPercent, '%', 'signalSize.secondHarmonicPercent'),
            ],
          },
        ]}
        note="Exact: the nonlinear circuit solved at the bias point ± the amplitude (quasi-static, capacitors holding their bias voltage)."
      />
      {s.ports.length > 0 ? (
        <ResultTable
          title="Junction swings"
          columns={[
            'Device',
            'Port',
            'Swing (peak)',
            'Scale (N·VT, or overdrive)',
            'Swing / scale',
            'Estimated error',
            'Rule of thumb',
          ]}
          rows={s.ports.map((p) => {
            const base = `signalSize.ports.${p.device}.${p.port}`;
            return {
              key: `${p.device}-${p.port}`,
              cells: [
                { text: show(p.device) },
                { text: portLabels[p.port] },
                num(p.swing, 'V', `${base}.swing`),
                num(p.scale, 'V', `${base}.scale`),
                num(p.ratio, '', `${base}.ratio`),
                num(p.estimatedErrorPercent, '%', `${base}.estimatedErrorPercent`),
                {
                  chip: p.withinCommonPractice ? 'within' : 'too large',
                  tone: p.withinCommonPractice ? 'ok' : 'caution',
                  path: `${base}.withinCommonPractice`,
                },
              ],
            };
          })}
          note="Rule of thumb (common practice, not a standard): the linear model holds while a junction's swing stays well under its N·VT — about 5 mV at room temperature for roughly 10 % error. Here: swing ≤ 0.2 × scale."
        />
      ) : (
        <p className="text-sm text-ink-600">No conducting junction moves with the signal.</p>
      )}
    </div>
  );
}
