import { formatValue, type DraftCircuit, type StandardSuggestionsResult } from '@biasproof/calc';
import { Button } from '@/components/ui/button.tsx';
import { ResultNumber } from '@/features/worksheets/components/results/result-cells.tsx';
import type { ResultCell, ResultRow } from '@/features/worksheets/components/results/result-csv.ts';
import { ResultTable } from '@/features/worksheets/components/results/result-table.tsx';
import { tableCell, tableHead } from '@/features/worksheets/components/variation/table-cells.tsx';
import type { VariationEditing } from '@/features/worksheets/components/variation/variation-draft.ts';
import { unitOfPath } from '@/features/worksheets/components/variation/variation-targets.ts';
import { findElementIndex } from '@/features/worksheets/draft/circuit-facts.ts';

/**
 * Each resistor's nearest preferred values (IEC 60063) with "Apply", which changes the part in
 * the draft through the undoable edit path; and the followed results with every resistor moved
 * to its series' value at once.
 */
export function StandardValuesSection({
  suggestions,
  circuit,
  edit,
  readOnly,
  show,
}: {
  suggestions: StandardSuggestionsResult;
  circuit: DraftCircuit;
  edit: VariationEditing['edit'];
  readOnly: boolean;
  show: (name: string) => string;
}) {
  const series = Object.keys(suggestions.recomputed) as (keyof typeof suggestions.recomputed)[];

  function apply(name: string, value: number) {
    const index = findElementIndex(circuit, name);
    const element = circuit.elements[index];
    if (element?.kind !== 'R') return;
    edit({ type: 'update-element', index, element: { ...element, value } });
  }

  const paths = Object.keys(suggestions.nominal);
  const recomputedRows: ResultRow[] = paths.map((path) => {
    const unit = unitOfPath(path);
    return {
      key: path,
      cells: [
        { text: path },
        {
          value: suggestions.nominal[path] ?? null,
          unit,
          path: `variation.standardValues.nominal.${path}`,
        },
        ...series.flatMap((s): ResultCell[] => {
          const r = suggestions.recomputed[s];
          const base = `variation.standardValues.recomputed.${s}.${path}`;
          return r?.ok
            ? [
                { value: r.values[path] ?? null, unit, path: base },
                {
                  value: r.changePercent[path] ?? null,
                  unit: '%',
                  path: `${base}.change`,
                  percent: true,
                },
              ]
            : [{ text: `did not solve: ${r?.error.message ?? ''}` }, { text: '—' }];
        }),
      ],
    };
  });

  return (
    <>
      <div className="overflow-x-auto rounded-md border border-rule">
        <table className="w-full border-collapse">
          <caption className="px-2 py-1.5 text-left text-sm font-bold text-ink-900">
            Nearest standard values
          </caption>
          <thead className="bg-paper">
            <tr>
              <th scope="col" className={tableHead}>
                Resistor
              </th>
              <th scope="col" className={tableHead}>
                Value
              </th>
              {series.map((s) => (
                <th key={s} scope="col" className={tableHead}>
                  {s}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {suggestions.resistors.map((r) => (
              <tr key={r.element} className="border-t border-rule">
                <th scope="row" className={`${tableCell} text-left font-semibold`}>
                  {show(r.element)}
                </th>
                <td className={tableCell}>
                  <ResultNumber
                    value={r.value}
                    unit="Ω"
                    path={`variation.standardValues.${r.element}.value`}
                  />
                </td>
                {series.map((s) => {
                  const v = r.suggestions[s];
                  if (!v)
                    return (
                      <td key={s} className={tableCell}>
                        —
                      </td>
                    );
                  const same = v.value === r.value;
                  return (
                    <td key={s} className={tableCell}>
                      <span className="flex flex-wrap items-center gap-2">
                        <ResultNumber
                          value={v.value}
                          unit="Ω"
                          path={`variation.standardValues.${r.element}.${s}`}
                        />
                        <span className="text-xs text-ink-600">
                          (
                          {same
                            ? 'exact'
                            : `${v.errorPercent > 0 ? '+' : '−'}${formatValue(Math.abs(v.errorPercent), '%', { digits: 2 })}`}
                          )
                        </span>
                        {readOnly || same ? null : (
                          <Button
                            size="sm"
                            variant="outline"
                            aria-label={`Apply ${formatValue(v.value, 'Ω')} (${s}) to ${show(r.element)}`}
                            onClick={() => apply(r.element, v.value)}
                          >
                            Apply
                          </Button>
                        )}
                      </span>
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {paths.length > 0 ? (
        <ResultTable
          title="With every resistor at its series value"
          columns={['Result', 'Now', ...series.flatMap((s) => [s, `${s} change`])]}
          rows={recomputedRows}
        />
      ) : null}
    </>
  );
}
