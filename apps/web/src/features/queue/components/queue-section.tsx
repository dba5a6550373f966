import type { WorksheetListItem } from '@biasproof/shared';
import { Card } from '@/components/ui/card.tsx';
import { EmptyState } from '@/components/ui/empty-state.tsx';
import { SkeletonRows } from '@/components/ui/skeleton-rows.tsx';
import { TextLink } from '@/components/ui/text-link.tsx';
import { orgPath } from '@/lib/current-org.tsx';

const updatedFormat = new Intl.DateTimeFormat(undefined, {
  dateStyle: 'medium',
  timeStyle: 'short',
});

export interface QueueSectionCopy {
  id: string;
  title: string;
  /** Shown when the list is empty. */
  emptyTitle: string;
  emptyText: string;
  /** Who to name beside each worksheet, e.g. the author of a revision to check. */
  person: (item: WorksheetListItem) => string | null;
}

/** One list of the queue: its count, its worksheets (links), or why it is empty. */
export function QueueSection({
  copy,
  items,
  orgSlug,
}: {
  copy: QueueSectionCopy;
  /** Undefined while loading. */
  items: readonly WorksheetListItem[] | undefined;
  orgSlug: string;
}) {
  const headingId = `queue-${copy.id}-heading`;
  return (
    <Card aria-labelledby={headingId} className="flex flex-col gap-3">
      <div className="flex items-baseline justify-between gap-3">
        <h2 id={headingId} className="text-lg font-semibold text-ink-900">
          {copy.title}
        </h2>
        {items ? (
          <span
            data-testid={`${copy.id}-count`}
            className="rounded-full bg-paper px-2.5 py-0.5 text-sm font-semibold text-ink-700 ring-1 ring-inset ring-ink-300"
          >
            {items.length}
            <span className="sr-only"> {items.length === 1 ? 'worksheet' : 'worksheets'}</span>
          </span>
        ) : null}
      </div>
      {!items ? (
        <SkeletonRows label={`Loading “${copy.title}”…`} rows={2} columns={2} />
      ) : items.length === 0 ? (
        <EmptyState title={copy.emptyTitle}>{copy.emptyText}</EmptyState>
      ) : (
        <ul className="flex flex-col divide-y divide-rule">
          {items.map((item) => {
            const person = copy.person(item);
            return (
              <li key={item.id} className="flex flex-col gap-0.5 py-2">
                <TextLink to={orgPath(orgSlug, `worksheets/${item.id}`)}>{item.title}</TextLink>
                <span className="text-sm text-ink-600">
                  {item.projectCode} · revision <span className="font-mono">{item.revision}</span>
                  {person ? ` · ${person}` : ''} · updated{' '}
                  {updatedFormat.format(new Date(item.updatedAt))}
                </span>
              </li>
            );
          })}
        </ul>
      )}
    </Card>
  );
}
