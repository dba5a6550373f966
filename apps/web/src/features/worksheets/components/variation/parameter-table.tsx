import { useFieldArray, useWatch, type UseFormReturn } from 'react-hook-form';
import { Button } from '@/components/ui/button.tsx';
import {
  newParameterRow,
  type SetupFormValues,
  type SetupValues,
} from '@/features/worksheets/components/variation/setup-form-values.ts';
import {
  CellInput,
  CellSelect,
  tableCell,
  tableHead,
} from '@/features/worksheets/components/variation/table-cells.tsx';
import type { TargetGroup } from '@/features/worksheets/components/variation/variation-targets.ts';

type SetupForm = UseFormReturn<SetupFormValues, unknown, SetupValues>;

/** Varied parameters, one row each: what varies, by how much, how it is drawn, its tempco. */
export function ParameterTable({
  form,
  targets,
  readOnly,
}: {
  form: SetupForm;
  targets: TargetGroup[];
  readOnly: boolean;
}) {
  const { control, register, formState } = form;
  const { fields, append, remove } = useFieldArray({ control, name: 'parameters' });
  const rows = useWatch({ control, name: 'parameters' });
  const errors = formState.errors.parameters;
  const known = new Set(targets.flatMap((g) => g.options.map((o) => o.value.toLowerCase())));
  const used = new Set(rows.map((r) => r.target.toLowerCase()));
  const nextTarget =
    targets.flatMap((g) => g.options).find((o) => !used.has(o.value.toLowerCase()))?.value ?? '';

  return (
    <div className="flex flex-col gap-2">
      {fields.length === 0 ? (
        <p className="text-sm text-ink-600">
          Nothing varies yet. Add the parts and model parameters whose tolerance matters.
        </p>
      ) : (
        <div className="overflow-x-auto rounded-md border border-rule">
          <table className="w-full border-collapse">
            <caption className="sr-only">Varied parameters ({fields.length})</caption>
            <thead className="bg-paper">
              <tr>
                <th scope="col" className={tableHead}>
                  Varies
                </th>
                <th scope="col" className={tableHead}>
                  Tolerance
                </th>
                <th scope="col" className={tableHead}>
                  Distribution
                </th>
                <th scope="col" className={tableHead}>
                  Tempco (ppm/K)
                </th>
                {readOnly ? null : (
                  <th scope="col" className={tableHead}>
                    <span className="sr-only">Actions</span>
                  </th>
                )}
              </tr>
            </thead>
            <tbody>
              {fields.map((field, i) => {
                const row = rows[i] ?? field;
                const name = row.target || `row ${i + 1}`;
                const e = errors?.[i];
                return (
                  <tr key={field.id} className="border-t border-rule">
                    <td className={tableCell}>
                      <CellSelect
                        label={`What varies, row ${i + 1}`}
                        error={e?.target?.message}
                        width="w-44"
                        {...register(`parameters.${i}.target`)}
                      >
                        <option value="">Choose…</option>
                        {row.target && !known.has(row.target.toLowerCase()) ? (
                          <option value={row.target}>{row.target} (not in the circuit)</option>
                        ) : null}
                        {targets.map((g) => (
                          <optgroup key={g.label} label={g.label}>
                            {g.options.map((o) => (
                              <option key={o.value} value={o.value}>
                                {o.label}
                              </option>
                            ))}
                          </optgroup>
                        ))}
                      </CellSelect>
                    </td>
                    <td className={tableCell}>
                      <div className="flex flex-wrap items-start gap-1">
                        <CellSelect
                          label={`Tolerance as, ${name}`}
                          {...register(`parameters.${i}.toleranceKind`)}
                        >
                          <option value="percent">± %</option>
                          <option value="range">min–max</option>
                        </CellSelect>
                        {row.toleranceKind === 'percent' ? (
                          <div>
                            <CellInput
                              label={`Tolerance (%) of ${name}`}
                              error={e?.tolerance?.message}
                              width="w-16"
                              {...register(`parameters.${i}.tolerance`)}
                            />
                          </div>
                        ) : (
                          <>
                            <div>
                              <CellInput
                                label={`Min of ${name}`}
                                error={e?.min?.message}
                                {...register(`parameters.${i}.min`)}
                              />
                            </div>
                            <div>
                              <CellInput
                                label={`Max of ${name}`}
                                error={e?.max?.message}
                                {...register(`parameters.${i}.max`)}
                              />
                            </div>
                          </>
                        )}
                      </div>
                    </td>
                    <td className={tableCell}>
                      <div className="flex flex-wrap items-start gap-1">
                        <CellSelect
                          label={`Distribution of ${name}`}
                          {...register(`parameters.${i}.distribution`)}
                        >
                          <option value="normal">Normal</option>
                          <option value="uniform">Uniform</option>
                        </CellSelect>
                        {row.distribution === 'normal' ? (
                          <div className="flex items-start gap-1">
                            <span className="py-1 text-xs text-ink-600">tolerance =</span>
                            <div>
                              <CellInput
                                label={`Sigmas the tolerance spans, ${name}`}
                                error={e?.sigmas?.message}
                                width="w-12"
                                {...register(`parameters.${i}.sigmas`)}
                              />
                            </div>
                            <span className="py-1 text-xs text-ink-600">σ</span>
                          </div>
                        ) : null}
                      </div>
                    </td>
                    <td className={tableCell}>
                      <CellInput
                        label={`Tempco (ppm/K) of ${name}`}
                        error={e?.tempco?.message}
                        {...register(`parameters.${i}.tempco`)}
                      />
                    </td>
                    {readOnly ? null : (
                      <td className={`${tableCell} text-right`}>
                        <Button
                          size="sm"
                          variant="quiet"
                          aria-label={`Remove ${name}`}
                          onClick={() => remove(i)}
                        >
                          Remove
                        </Button>
                      </td>
                    )}
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      )}
      {readOnly ? null : (
        <div>
          <Button size="sm" variant="outline" onClick={() => append(newParameterRow(nextTarget))}>
            Add varied parameter
          </Button>
        </div>
      )}
      <p className="text-xs text-ink-600">
        A normal tolerance spans ±3σ unless set otherwise; an empty tolerance keeps the value fixed
        (its tempco alone applies, about 27 °C). Values in engineering notation (9k9, 2.2u).
      </p>
    </div>
  );
}
