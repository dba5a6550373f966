import { useId, useState, type ReactNode } from 'react';
import { Button } from '@/components/ui/button.tsx';
import { CellContent } from '@/features/worksheets/components/results/result-cells.tsx';
import { toCsv, type ResultRow } from '@/features/worksheets/components/results/result-csv.ts';
import { StoredCsvLink } from '@/features/worksheets/components/results/stored-csv.tsx';
import type { StoredResultsTable } from '@/features/worksheets/api/results-csv-url.ts';

interface ResultTableProps {
  title: string;
  columns: readonly string[];
  rows: readonly ResultRow[];
  /** Short text under the title. */
  note?: ReactNode;
  /** The server's CSV table holding these rows, offered while the results are stored ones. */
  storedCsv?: StoredResultsTable | undefined;
}

// No uppercase: result headings hold symbols (β, rπ) whose capitals read as other letters.
const head = 'px-2 py-1.5 text-left text-xs font-semibold text-ink-600';
const cell = 'px-2 py-1.5 text-sm text-ink-900';

/** A titled table of results whose first column names the row; copyable as CSV. */
export function ResultTable({ title, columns, rows, note, storedCsv }: ResultTableProps) {
  const id = useId();
  const [copied, setCopied] = useState<string | null>(null);

  async function copy() {
    const csv = toCsv(columns, rows);
    try {
      await navigator.clipboard.writeText(csv);
      setCopied(`Copied ${rows.length} row${rows.length === 1 ? '' : 's'} of “${title}” as CSV.`);
    } catch {
      setCopied('The browser did not allow copying; select the table and copy it instead.');
    }
  }

  return (
    <section aria-labelledby={`${id}-title`} className="flex flex-col gap-2">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 id={`${id}-title`} className="text-sm font-bold text-ink-900">
          {title}
        </h3>
        <div className="flex flex-wrap items-baseline gap-1">
          <Button
            size="sm"
            variant="quiet"
            aria-label={`Copy “${title}” as CSV`}
            onClick={() => void copy()}
          >
            Copy as CSV
          </Button>
          {storedCsv ? <StoredCsvLink table={storedCsv} /> : null}
        </div>
      </div>
      {note ? <p className="-mt-1 text-xs text-ink-600">{note}</p> : null}
      <div className="overflow-x-auto rounded-md border border-rule">
        <table className="w-full border-collapse" aria-labelledby={`${id}-title`}>
          <thead className="bg-paper">
            <tr>
              {columns.map((c) => (
                <th key={c} scope="col" className={head}>
                  {c}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((row) => (
              <tr key={row.key} className="border-t border-rule">
                {row.cells.map((c, i) =>
                  i === 0 ? (
                    <th key={i} scope="row" className={`${cell} text-left font-semibold`}>
                      <CellContent cell={c} />
                    </th>
                  ) : (
                    <td key={i} className={cell}>
                      <CellContent cell={c} />
                    </td>
                  ),
                )}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p role="status" className="text-xs text-ok">
        {copied}
      </p>
    </section>
  );
}
