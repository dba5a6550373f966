import { useId } from 'react';
import type { PersonRef } from '@biasproof/shared';
import { Button } from '@/components/ui/button.tsx';
import { ErrorMessage } from '@/components/ui/message.tsx';
import { useWatchers } from '@/features/review/api/get-watchers.ts';
import { useStartWatching } from '@/features/review/api/start-watching.ts';
import { useStopWatching } from '@/features/review/api/stop-watching.ts';

function names(people: readonly PersonRef[]): string {
  const all = people.map((p) => p.name);
  return all.length <= 1 ? (all[0] ?? '') : `${all.slice(0, -1).join(', ')} and ${all.at(-1)}`;
}

/** "You and Priya Raman watch this worksheet." in every combination of me and the others. */
export function whoWatches(watching: boolean, others: readonly PersonRef[]): string {
  if (others.length === 0) {
    return watching ? 'You watch this worksheet.' : 'Nobody watches this worksheet yet.';
  }
  if (watching) return `You and ${names(others)} watch this worksheet.`;
  return `${names(others)} ${others.length === 1 ? 'watches' : 'watch'} this worksheet.`;
}

/**
 * Any member may watch a worksheet to receive the e-mail when it is signed off. A toggle
 * button (its name stays "Watch"; `aria-pressed` says whether it is on) and who watches.
 */
export function WatchToggle({
  orgId,
  worksheetId,
  userId,
}: {
  orgId: string;
  worksheetId: string;
  userId: string;
}) {
  const id = useId();
  const watchers = useWatchers(orgId, worksheetId);
  const start = useStartWatching(orgId, worksheetId);
  const stop = useStopWatching(orgId, worksheetId);
  const busy = start.isPending || stop.isPending;
  const failure = start.error ?? stop.error;

  if (watchers.isError) {
    return <ErrorMessage>The watchers could not be loaded: {watchers.error.message}</ErrorMessage>;
  }
  if (!watchers.data) return null;
  const { watching } = watchers.data;
  const others = watchers.data.watchers.filter((p) => p.id !== userId);
  const toggle = () => {
    // Not disabled while busy: a disabled button would drop the keyboard focus.
    if (busy) return;
    start.reset();
    stop.reset();
    if (watching) stop.mutate();
    else start.mutate();
  };

  return (
    <div className="flex flex-col gap-1">
      <div className="flex flex-wrap items-center gap-2">
        <Button
          size="sm"
          variant={watching ? 'primary' : 'outline'}
          aria-pressed={watching}
          aria-describedby={`${id}-who`}
          aria-busy={busy}
          onClick={toggle}
        >
          <span aria-hidden="true" className="mr-1">
            {watching ? '✓' : '+'}
          </span>
          Watch
        </Button>
        <p id={`${id}-who`} role="status" className="text-sm text-ink-700">
          {whoWatches(watching, others)} Watchers receive the e-mail when it is signed off.
        </p>
      </div>
      {failure ? (
        <ErrorMessage>
          {watching ? 'Watching could not be stopped' : 'Watching could not start'}:{' '}
          {failure.message}
        </ErrorMessage>
      ) : null}
    </div>
  );
}
