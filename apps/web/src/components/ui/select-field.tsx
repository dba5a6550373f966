import { useId, type ComponentProps, type ReactNode } from 'react';

type SelectFieldProps = Omit<ComponentProps<'select'>, 'id'> & {
  label: string;
  error?: string | undefined;
  children: ReactNode;
};

/** A labelled select; works with react-hook-form's `register()` and as a controlled select. */
export function SelectField({
  label,
  error,
  className = '',
  children,
  ...props
}: SelectFieldProps) {
  const id = useId();
  const errorId = `${id}-error`;
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={id} className="text-sm font-semibold text-ink-700">
        {label}
      </label>
      <select
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? errorId : undefined}
        className={`rounded-md border bg-surface px-3 py-2 text-ink-900 focus-visible:outline-2 focus-visible:outline-offset-1 focus-visible:outline-accent ${error ? 'border-fault' : 'border-ink-500'}`}
        {...props}
      >
        {children}
      </select>
      {error ? (
        <p id={errorId} className="text-sm font-semibold text-fault">
          {error}
        </p>
      ) : null}
    </div>
  );
}
