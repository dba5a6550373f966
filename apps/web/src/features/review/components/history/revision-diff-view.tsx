import type { DiffEntry, RevisionDiff } from '@biasproof/shared';
import { EmptyState } from '@/components/ui/empty-state.tsx';
import { formatPinned } from '@/features/review/components/review-format.ts';

const head = 'px-2 py-1.5 text-left text-xs font-semibold text-ink-600';
const cell = 'px-2 py-1.5 text-sm text-ink-900 tabular-nums whitespace-nowrap';

// Diff paths of results carry a `results.` prefix; the unit guess reads the path without it.
const shown = (entry: DiffEntry, value: DiffEntry['before']) =>
  typeof value === 'boolean'
    ? String(value)
    : formatPinned(value, entry.path.replace(/^results\./, ''));

function percent(relative: number | undefined): string {
  if (relative === undefined) return '—';
  const p = relative * 100;
  return `${p > 0 ? '+' : ''}${Number(p.toPrecision(3))} %`;
}

function delta(entry: DiffEntry): string {
  if (entry.delta === undefined) return '—';
  const text = formatPinned(entry.delta, entry.path.replace(/^results\./, ''));
  return entry.delta > 0 ? `+${text}` : text;
}

const changeWords: Record<DiffEntry['change'], string> = {
  added: 'added',
  removed: 'removed',
  changed: 'changed',
};

function DiffTable({
  title,
  entries,
  withDelta,
  empty,
}: {
  title: string;
  entries: readonly DiffEntry[];
  withDelta: boolean;
  empty: string;
}) {
  const id = `diff-${title.toLowerCase().replace(/[^a-z]+/g, '-')}`;
  return (
    <section aria-labelledby={id} className="flex flex-col gap-2">
      <h3 id={id} className="font-semibold text-ink-900">
        {title} <span className="font-normal text-ink-600">({entries.length})</span>
      </h3>
      {entries.length === 0 ? (
        <EmptyState title={empty} />
      ) : (
        <div className="overflow-x-auto rounded-md border border-rule">
          <table className="w-full border-collapse" aria-labelledby={id}>
            <thead className="bg-paper">
              <tr>
                <th scope="col" className={head}>
                  Path
                </th>
                <th scope="col" className={head}>
                  Before
                </th>
                <th scope="col" className={head}>
                  After
                </th>
                {withDelta ? (
                  <>
                    <th scope="col" className={head}>
                      Change
                    </th>
                    <th scope="col" className={head}>
                      Relative
                    </th>
                  </>
                ) : null}
              </tr>
            </thead>
            <tbody>
              {entries.map((e) => (
                <tr key={e.path} className="border-t border-rule">
                  <th
                    scope="row"
                    className={`${cell} !whitespace-normal break-all text-left font-mono text-xs font-semibold`}
                  >
                    {e.path}
                    {e.change === 'changed' ? null : (
                      <span className="ml-1 font-sans font-normal text-ink-600">
                        ({changeWords[e.change]})
                      </span>
                    )}
                  </th>
                  <td className={cell}>{shown(e, e.before)}</td>
                  <td className={cell}>{shown(e, e.after)}</td>
                  {withDelta ? (
                    <>
                      <td className={cell}>{delta(e)}</td>
                      <td className={cell}>{percent(e.relative)}</td>
                    </>
                  ) : null}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}

/** Which inputs changed between two revisions and how far each result moved. */
export function RevisionDiffView({ diff }: { diff: RevisionDiff }) {
  return (
    <div className="flex flex-col gap-6">
      <DiffTable
        title="Inputs changed"
        entries={diff.inputs}
        withDelta={false}
        empty="No input changed."
      />
      <DiffTable title="Results moved" entries={diff.results} withDelta empty="No result moved." />
      <p className="text-xs text-ink-600">
        Results that moved by less than {diff.tolerance.toExponential(0)} (relative) are not listed:
        that is rounding, not a change.
      </p>
    </div>
  );
}
