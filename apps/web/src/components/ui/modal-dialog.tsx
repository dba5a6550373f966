import { useEffect, useId, useRef, type KeyboardEvent, type ReactNode } from 'react';
import { createPortal } from 'react-dom';

interface ModalDialogProps {
  title: string;
  children: ReactNode;
  /** The dialog's buttons; the first one takes focus when it opens. */
  actions: ReactNode;
  /** Escape calls this; without it Escape does nothing (the person must choose). */
  onDismiss?: () => void;
  /** `dialog` for a form to fill in; `alertdialog` (default) for a question to answer. */
  role?: 'dialog' | 'alertdialog';
}

/** What Tab may reach inside the dialog. */
const focusable =
  'a[href], button:not([disabled]), input:not([disabled]), select:not([disabled]), textarea:not([disabled]), [tabindex]:not([tabindex="-1"])';

/**
 * A modal question with buttons of the caller's choosing (ConfirmDialog is the two-button
 * case), or a small form. Tab stays inside, and focus goes back where it was when the dialog
 * closes. Focus starts on the element marked `data-autofocus`, else on the first action.
 */
export function ModalDialog({
  title,
  children,
  actions,
  onDismiss,
  role = 'alertdialog',
}: ModalDialogProps) {
  const id = useId();
  const panel = useRef<HTMLDivElement>(null);

  useEffect(() => {
    const opener = document.activeElement instanceof HTMLElement ? document.activeElement : null;
    const start =
      panel.current?.querySelector<HTMLElement>('[data-autofocus]') ??
      panel.current?.querySelector<HTMLElement>('[data-actions] button');
    start?.focus();
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
    const stops = [...panel.current.querySelectorAll<HTMLElement>(focusable)];
    const first = stops[0];
    const last = stops[stops.length - 1];
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
        role={role}
        aria-modal="true"
        aria-labelledby={`${id}-title`}
        aria-describedby={`${id}-body`}
        onKeyDown={onKeyDown}
        className="max-h-[90vh] w-full max-w-lg overflow-y-auto rounded-lg bg-surface p-6 shadow-lg"
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
