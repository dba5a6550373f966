import { useEffect, useId, useRef, type KeyboardEvent, type ReactNode } from 'react';
import { createPortal } from 'react-dom';
import { Button } from '@/components/ui/button.tsx';

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
 * Asks before a destructive action. Modal: focus starts on "Cancel" (the safe choice), Tab
 * stays inside, Escape cancels, and focus goes back where it was when the dialog closes.
 */
export function ConfirmDialog({
  title,
  children,
  confirmLabel,
  onConfirm,
  onCancel,
  busy = false,
}: ConfirmDialogProps) {
  const id = useId();
  const panel = useRef<HTMLDivElement>(null);
  const cancel = useRef<HTMLButtonElement>(null);

  useEffect(() => {
    const opener = document.activeElement instanceof HTMLElement ? document.activeElement : null;
    cancel.current?.focus();
    return () => {
      // The opener may be gone (its row removed): then the page's main region takes focus.
      if (opener?.isConnected) opener.focus();
      else document.getElementById('main')?.focus();
    };
  }, []);

  function keepFocusInside(event: KeyboardEvent<HTMLDivElement>) {
    if (event.key === 'Escape' && !busy) {
      event.preventDefault();
      onCancel();
      return;
    }
    if (event.key !== 'Tab' || !panel.current) return;
    const buttons = [...panel.current.querySelectorAll('button')];
    const first = buttons[0];
    const last = buttons[buttons.length - 1];
    if (event.shiftKey && document.activeElement === first) {
      event.preventDefault();
      last?.focus();
    } else if (!event.shiftKey && document.activeElement === last) {
      event.preventDefault();
      first?.focus();
    }
  }

  return createPortal(
    <div className="fixed inset-0 z-20 flex items-center justify-center bg-ink-900/50 p-4">
      <div
        ref={panel}
        role="alertdialog"
        aria-modal="true"
        aria-labelledby={`${id}-title`}
        aria-describedby={`${id}-body`}
        onKeyDown={keepFocusInside}
        className="w-full max-w-md rounded-lg bg-surface p-6 shadow-lg"
      >
        <h2 id={`${id}-title`} className="text-lg font-bold text-ink-900">
          {title}
        </h2>
        <div id={`${id}-body`} className="mt-2 text-ink-700">
          {children}
        </div>
        <div className="mt-6 flex justify-end gap-3">
          <Button ref={cancel} variant="outline" onClick={onCancel} disabled={busy}>
            Cancel
          </Button>
          <Button variant="danger" onClick={onConfirm} disabled={busy}>
            {confirmLabel}
          </Button>
        </div>
      </div>
    </div>,
    document.body,
  );
}
