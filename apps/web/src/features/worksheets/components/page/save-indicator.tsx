import { Button } from '@/components/ui/button.tsx';
import { StatusBadge, type StatusTone } from '@/components/ui/status-badge.tsx';
import type { SaveStatus } from '@/features/worksheets/hooks/use-autosave.ts';

const shown: Record<SaveStatus, { text: string; tone: StatusTone; title: string }> = {
  saved: { text: 'Saved', tone: 'ok', title: 'The server holds every edit.' },
  unsaved: { text: 'Unsaved edits', tone: 'pending', title: 'Saved as soon as you pause.' },
  saving: { text: 'Saving…', tone: 'pending', title: 'Sending the draft to the server.' },
  conflict: {
    text: 'Conflict',
    tone: 'fault',
    title: 'Someone else saved this worksheet since you opened it.',
  },
  error: { text: 'Not saved', tone: 'fault', title: 'The last save failed.' },
};

/** Where the author's edits are: saved, waiting, on their way, in conflict or failed. */
export function SaveIndicator({
  status,
  problem,
  onRetry,
}: {
  status: SaveStatus;
  problem: string | null;
  onRetry: () => void;
}) {
  const { text, tone, title } = shown[status];
  return (
    <div className="flex flex-wrap items-center gap-2">
      <StatusBadge tone={tone} label={`Save status: ${text}`} title={problem ?? title}>
        {text}
      </StatusBadge>
      {status === 'error' ? (
        <>
          <span className="text-sm text-fault">{problem}</span>
          <Button size="sm" variant="outline" onClick={onRetry}>
            Try again
          </Button>
        </>
      ) : null}
    </div>
  );
}
