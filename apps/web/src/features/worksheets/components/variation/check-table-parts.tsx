import type { ReactNode } from 'react';
import { Button } from '@/components/ui/button.tsx';
import { tableCell, tableHead } from '@/features/worksheets/components/variation/table-cells.tsx';

/** What the limit and hand-check tables share: row keys, the table frame, the row actions. */

/** A result path's key among the rows: the path, numbered when it appears more than once. */
export function rowKeys(paths: readonly string[]): string[] {
  const seen = new Map<string, number>();
  return paths.map((p) => {
    const n = (seen.get(p) ?? 0) + 1;
    seen.set(p, n);
    return n === 1 ? p : `${p}#${n}`;
  });
}

export function CheckActions({
  what,
  onEdit,
  onDelete,
}: {
  what: string;
  onEdit: () => void;
  onDelete: () => void;
}) {
  return (
    <td className={`${tableCell} whitespace-nowrap text-right`}>
      <Button size="sm" variant="quiet" aria-label={`Edit ${what}`} onClick={onEdit}>
        Edit
      </Button>
      <Button size="sm" variant="quiet" aria-label={`Delete ${what}`} onClick={onDelete}>
        Delete
      </Button>
    </td>
  );
}

export function CheckTable({
  caption,
  columns,
  children,
}: {
  caption: string;
  columns: string[];
  children: ReactNode;
}) {
  return (
    <div className="overflow-x-auto rounded-md border border-rule">
      <table className="w-full border-collapse">
        <caption className="sr-only">{caption}</caption>
        <thead className="bg-paper">
          <tr>
            {columns.map((c, i) => (
              <th key={i} scope="col" className={tableHead}>
                {c || <span className="sr-only">Actions</span>}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>{children}</tbody>
      </table>
    </div>
  );
}
