import { useEffect, useId, useRef, type KeyboardEvent, type ReactNode } from 'react';
import { createPortal } from 'react-dom';

interface ModalDialogProps {
  title: string;
  children: ReactNode;
  /** The dialog's buttons; the first one takes focus when it opens. */
  actions: ReactNode;
  /** Escape calls this; without it Escape does nothing (the person must choose). */
  onDismiss?: () => void;
}

/**
 * A modal question with buttons of the caller's choosing (ConfirmDialog is the two-button
 * case). Tab stays inside, and focus goes back where it was when the dialog closes.
 */
export function ModalDialog({ title, children, actions, onDismiss }: ModalDialogProps) {
  const id = useId();
  const panel = useRef<HTMLDivElement>(null);

  useEffect(() => {
    const opener = document.activeElement instanceof HTMLElement ? document.activeElement : null;
    panel.current?.querySelector<HTMLElement>('[data-actions] button')?.focus();
    return () => {
      if (opener?.isConnected) opener.focus();
      else document.getElementById('main')?.focus();
    };
  }, []);

  function onKeyDown(event: KeyboardEvent<HTMLDivElement>) {
    if (event.key === 'Escape' && onDismiss) {
      event.preventDefault();
      onDismiss();
      return;
    }
    if (event.key !== 'Tab' || !panel.current) return;
    const buttons = [...panel.current.querySelectorAll<HTMLElement>('button:not([disabled])')];
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
        onKeyDown={onKeyDown}
        className="w-full max-w-lg rounded-lg bg-surface p-6 shadow-lg"
      >
        <h2 id={`${id}-title`} className="text-lg font-bold text-ink-900">
          {title}
        </h2>
        <div id={`${id}-body`} className="mt-2 flex flex-col gap-2 text-ink-700">
          {children}
        </div>
        <div data-actions className="mt-6 flex flex-wrap justify-end gap-3">
          {actions}
        </div>
      </div>
    </div>,
    document.body,
  );
}
