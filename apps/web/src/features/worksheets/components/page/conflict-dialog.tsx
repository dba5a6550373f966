import { useState } from 'react';
import { Button } from '@/components/ui/button.tsx';
import { ModalDialog } from '@/components/ui/modal-dialog.tsx';

/**
 * Someone saved the worksheet after this page read it (409 `stale-version`): the author takes
 * their version (dropping the unsaved edits here) or saves these edits over it.
 */
export function ConflictDialog({
  message,
  onLoadTheirs,
  onKeepMine,
}: {
  message: string | null;
  onLoadTheirs: () => Promise<void>;
  onKeepMine: () => Promise<void>;
}) {
  const [busy, setBusy] = useState(false);
  const run = (action: () => Promise<void>) => {
    setBusy(true);
    void action().finally(() => setBusy(false));
  };
  return (
    <ModalDialog
      title="Someone else saved this worksheet"
      actions={
        <>
          <Button variant="outline" disabled={busy} onClick={() => run(onLoadTheirs)}>
            Load their version
          </Button>
          <Button disabled={busy} onClick={() => run(onKeepMine)}>
            Keep mine as a new save
          </Button>
        </>
      }
    >
      <p>
        Your latest edits were not saved, because the worksheet changed on the server since this
        page read it.
      </p>
      {message ? <p className="text-sm text-ink-600">{message}</p> : null}
      <p>
        <strong>Load their version</strong> drops your unsaved edits and shows the saved worksheet.{' '}
        <strong>Keep mine as a new save</strong> saves what you see here over their version.
      </p>
    </ModalDialog>
  );
}
