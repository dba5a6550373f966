import type { ReactNode } from 'react';
import { Button } from '@/components/ui/button.tsx';
import { ModalDialog } from '@/components/ui/modal-dialog.tsx';

interface ConfirmDialogProps {
  title: string;
  children: ReactNode;
  confirmLabel: string;
  onConfirm: () => void;
  onCancel: () => void;
  /** While the action runs, both buttons wait. */
  busy?: boolean;
}

/**
 * Asks before a destructive action: the two-button case of ModalDialog. Focus starts on
 * "Cancel" (the safe choice, listed first), and Escape cancels unless the action is running.
 */
export function ConfirmDialog({
  title,
  children,
  confirmLabel,
  onConfirm,
  onCancel,
  busy = false,
}: ConfirmDialogProps) {
  return (
    <ModalDialog
      title={title}
      {...(busy ? {} : { onDismiss: onCancel })}
      actions={
        <>
          <Button variant="outline" onClick={onCancel} disabled={busy}>
            Cancel
          </Button>
          <Button variant="danger" onClick={onConfirm} disabled={busy}>
            {confirmLabel}
          </Button>
        </>
      }
    >
      {children}
    </ModalDialog>
  );
}
