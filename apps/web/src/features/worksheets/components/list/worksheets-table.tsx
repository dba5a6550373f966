import type { KeyboardEvent } from 'react';
import { Link } from 'react-router-dom';
import type { WorksheetListItem } from '@biasproof/shared';
import { StateChip } from '@/features/worksheets/components/state-chip.tsx';
import {
  firstDirection,
  type ListParams,
  type SortColumn,
} from '@/features/worksheets/components/list/list-params.ts';
import { orgPath, useCurrentOrg } from '@/lib/current-org.tsx';

const head = 'px-3 py-2 text-left text-xs font-semibold uppercase tracking-wide text-ink-600';
const cell = 'px-3 py-2 align-top text-sm text-ink-900';

const updatedFormat = new Intl.DateTimeFormat(undefined, {
  dateStyle: 'medium',
  timeStyle: 'short',
});

interface WorksheetsTableProps {
  items: readonly WorksheetListItem[];
  total: number;
  params: ListParams;
  onSort: (sort: SortColumn, dir: ListParams['dir']) => void;
  /** Leave out the project column (the list is one project's). */
  hideProject?: boolean;
}

function SortableHeader({
  column,
  label,
  params,
  onSort,
}: {
  column: SortColumn;
  label: string;
  params: ListParams;
  onSort: WorksheetsTableProps['onSort'];
}) {
  const active = params.sort === column;
  const next = active ? (params.dir === 'asc' ? 'desc' : 'asc') : firstDirection[column];
  return (
    <th
      scope="col"
      className={head}
      aria-sort={active ? (params.dir === 'asc' ? 'ascending' : 'descending') : 'none'}
    >
      <button
        type="button"
        onClick={() => onSort(column, next)}
        className="inline-flex items-center gap-1 rounded-sm uppercase tracking-wide hover:text-ink-900 focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-accent"
      >
        {label}
        <span aria-hidden="true" className={active ? 'text-accent' : 'text-ink-300'}>
          {active ? (params.dir === 'asc' ? '▲' : '▼') : '↕'}
        </span>
      </button>
    </th>
  );
}

/** Up and down arrows move between the rows' links, so the table reads like a list. */
function moveBetweenRows(event: KeyboardEvent<HTMLTableSectionElement>) {
  if (event.key !== 'ArrowDown' && event.key !== 'ArrowUp') return;
  const links = [...event.currentTarget.querySelectorAll<HTMLAnchorElement>('a[data-row-link]')];
  const index = links.findIndex((l) => l === document.activeElement);
  if (index === -1) return;
  const target = links[event.key === 'ArrowDown' ? index + 1 : index - 1];
  if (!target) return;
  event.preventDefault();
  target.focus();
}

export function WorksheetsTable({
  items,
  total,
  params,
  onSort,
  hideProject,
}: WorksheetsTableProps) {
  const { membership, user } = useCurrentOrg();
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse">
        <caption className="sr-only">
          Worksheets ({total}); use the arrow keys to move between rows
        </caption>
        <thead className="border-b border-rule">
          <tr>
            <SortableHeader column="title" label="Worksheet" params={params} onSort={onSort} />
            {hideProject ? null : (
              <th scope="col" className={head}>
                Project
              </th>
            )}
            <SortableHeader column="state" label="State" params={params} onSort={onSort} />
            <th scope="col" className={head}>
              Rev.
            </th>
            <th scope="col" className={head}>
              Author
            </th>
            <SortableHeader column="updatedAt" label="Updated" params={params} onSort={onSort} />
          </tr>
        </thead>
        <tbody onKeyDown={moveBetweenRows}>
          {items.map((ws) => (
            <tr key={ws.id} className="border-b border-rule last:border-b-0 hover:bg-paper">
              <th scope="row" className={`${cell} text-left font-normal`}>
                <Link
                  data-row-link
                  to={orgPath(membership.orgSlug, `worksheets/${ws.id}`)}
                  className="font-semibold text-accent underline-offset-2 hover:underline focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-accent"
                >
                  {ws.title}
                </Link>
                {ws.description ? (
                  <p className="mt-0.5 line-clamp-1 text-xs text-ink-600">{ws.description}</p>
                ) : null}
              </th>
              {hideProject ? null : (
                <td className={cell}>
                  <span className="font-mono text-xs" title={ws.projectName}>
                    {ws.projectCode}
                  </span>
                </td>
              )}
              <td className={cell}>
                <StateChip state={ws.state} />
              </td>
              <td className={`${cell} font-mono`}>{ws.revision}</td>
              <td className={cell}>{ws.author.id === user.id ? 'You' : ws.author.name}</td>
              <td className={`${cell} whitespace-nowrap tabular-nums text-ink-700`}>
                <time dateTime={ws.updatedAt}>{updatedFormat.format(new Date(ws.updatedAt))}</time>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
