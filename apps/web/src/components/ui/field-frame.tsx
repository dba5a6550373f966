import { useId, type ReactNode } from 'react';

/** What a labelled control needs to wire itself to its label, hint and error. */
export interface FieldControlProps {
  id: string;
  'aria-invalid': true | undefined;
  'aria-describedby': string | undefined;
  className: string;
}

interface FieldFrameProps {
  label: string;
  error?: string | undefined;
  hint?: string | undefined;
  className?: string;
  /** Renders the control with the ids and classes that tie it to the label and messages. */
  children: (control: FieldControlProps) => ReactNode;
}

/**
 * The label, hint and error around one form control, shared by the single- and multi-line
 * text fields so that both describe themselves to assistive technology the same way.
 */
export function FieldFrame({ label, error, hint, className = '', children }: FieldFrameProps) {
  const id = useId();
  const hintId = `${id}-hint`;
  const errorId = `${id}-error`;
  const describedBy =
    [hint ? hintId : null, error ? errorId : null].filter(Boolean).join(' ') || undefined;
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={id} className="text-sm font-semibold text-ink-700">
        {label}
      </label>
      {children({
        id,
        'aria-invalid': error ? true : undefined,
        'aria-describedby': describedBy,
        className: `rounded-md border bg-surface px-3 py-2 text-ink-900 focus-visible:outline-2 focus-visible:outline-offset-1 focus-visible:outline-accent ${error ? 'border-fault' : 'border-ink-500'}`,
      })}
      {hint ? (
        <p id={hintId} className="text-sm text-ink-600">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={errorId} className="text-sm font-semibold text-fault">
          {error}
        </p>
      ) : null}
    </div>
  );
}
