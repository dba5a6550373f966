import { useFieldArray, useWatch, type UseFormReturn } from 'react-hook-form';
import { Button } from '@/components/ui/button.tsx';
import {
  newRatingRow,
  ratingFields,
  type SetupFormValues,
  type SetupValues,
} from '@/features/worksheets/components/variation/setup-form-values.ts';
import {
  CellInput,
  CellSelect,
  tableCell,
  tableHead,
} from '@/features/worksheets/components/variation/table-cells.tsx';

type SetupForm = UseFormReturn<SetupFormValues, unknown, SetupValues>;

/** Ratings of the parts whose stress is checked; an empty cell means not rated. */
export function RatingTable({
  form,
  parts,
  readOnly,
}: {
  form: SetupForm;
  parts: string[];
  readOnly: boolean;
}) {
  const { control, register, formState } = form;
  const { fields, append, remove } = useFieldArray({ control, name: 'ratings' });
  const rows = useWatch({ control, name: 'ratings' });
  const errors = formState.errors.ratings;
  const used = new Set(rows.map((r) => r.element.toLowerCase()));
  const next = parts.find((p) => !used.has(p.toLowerCase())) ?? '';

  return (
    <div className="flex flex-col gap-2">
      {fields.length === 0 ? (
        <p className="text-sm text-ink-600">
          No ratings yet: stress is shown, unrated. Add a part to check it against its ratings.
        </p>
      ) : (
        <div className="overflow-x-auto rounded-md border border-rule">
          <table className="w-full border-collapse">
            <caption className="sr-only">Part ratings ({fields.length})</caption>
            <thead className="bg-paper">
              <tr>
                <th scope="col" className={tableHead}>
                  Part
                </th>
                {ratingFields.map(([key, label]) => (
                  <th key={key} scope="col" className={tableHead}>
                    {label}
                  </th>
                ))}
                {readOnly ? null : (
                  <th scope="col" className={tableHead}>
                    <span className="sr-only">Actions</span>
                  </th>
                )}
              </tr>
            </thead>
            <tbody>
              {fields.map((field, i) => {
                const element = rows[i]?.element || `row ${i + 1}`;
                return (
                  <tr key={field.id} className="border-t border-rule">
                    <td className={tableCell}>
                      <CellSelect
                        label={`Rated part, row ${i + 1}`}
                        error={errors?.[i]?.element?.message}
                        {...register(`ratings.${i}.element`)}
                      >
                        <option value="">Choose…</option>
                        {parts.map((p) => (
                          <option key={p} value={p}>
                            {p}
                          </option>
                        ))}
                      </CellSelect>
                    </td>
                    {ratingFields.map(([key, label]) => (
                      <td key={key} className={tableCell}>
                        <CellInput
                          label={`${label} rating of ${element}`}
                          error={errors?.[i]?.[key]?.message}
                          width="w-16"
                          {...register(`ratings.${i}.${key}`)}
                        />
                      </td>
                    ))}
                    {readOnly ? null : (
                      <td className={`${tableCell} text-right`}>
                        <Button
                          size="sm"
                          variant="quiet"
                          aria-label={`Remove the ratings of ${element}`}
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
      {readOnly || parts.length === 0 ? null : (
        <div>
          <Button size="sm" variant="outline" onClick={() => append(newRatingRow(next))}>
            Add part rating
          </Button>
        </div>
      )}
    </div>
  );
}
