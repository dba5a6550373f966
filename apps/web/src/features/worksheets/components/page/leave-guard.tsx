import { useEffect } from 'react';
import { useBlocker } from 'react-router-dom';
import { ConfirmDialog } from '@/components/ui/confirm-dialog.tsx';

/**
 * While edits are not saved, leaving the page asks first: the browser's own prompt for a reload
 * or a closed tab, this dialog for a link inside the app.
 */
export function LeaveGuard({ when }: { when: boolean }) {
  const blocker = useBlocker(
    ({ currentLocation, nextLocation }) =>
      when && currentLocation.pathname !== nextLocation.pathname,
  );

  useEffect(() => {
    if (!when) return;
    const warn = (event: BeforeUnloadEvent) => {
      event.preventDefault();
      // Older browsers show the prompt only when returnValue is set.
      event.returnValue = '';
    };
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [when]);

  if (blocker.state !== 'blocked') return null;
  return (
    <ConfirmDialog
      title="Leave without saving?"
      confirmLabel="Leave anyway"
      onConfirm={() => blocker.proceed()}
      onCancel={() => blocker.reset()}
    >
      Your latest edits to this worksheet are not saved yet. If you leave now, they are lost.
    </ConfirmDialog>
  );
}
