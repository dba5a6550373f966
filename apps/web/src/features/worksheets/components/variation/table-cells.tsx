import { useId, type ComponentProps, type ReactNode } from 'react';

/**
 * Inputs for the cells of a table form: the column heading is the visible label, so each
 * control carries its own accessible name (which row, which column) and its error below it.
 */

const control = (error: string | undefined, width: string) =>
  `${width} rounded-md border bg-surface px-2 py-1 text-sm text-ink-900 focus-visible:outline-2 focus-visible:outline-offset-1 focus-visible:outline-accent ${error ? 'border-fault' : 'border-ink-500'}`;

function CellError({ id, error }: { id: string; error: string | undefined }) {
  return error ? (
    <p id={id} className="mt-0.5 max-w-48 text-xs font-semibold text-fault">
      {error}
    </p>
  ) : null;
}

type CellInputProps = Omit<ComponentProps<'input'>, 'id' | 'className'> & {
  label: string;
  error?: string | undefined;
  width?: string;
};

export function CellInput({ label, error, width = 'w-20', ...props }: CellInputProps) {
  const id = useId();
  return (
    <>
      <input
        aria-label={label}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        autoComplete="off"
        spellCheck={false}
        className={control(error, width)}
        {...props}
      />
      <CellError id={`${id}-error`} error={error} />
    </>
  );
}

type CellSelectProps = Omit<ComponentProps<'select'>, 'id' | 'className'> & {
  label: string;
  error?: string | undefined;
  width?: string;
  children: ReactNode;
};

export function CellSelect({
  label,
  error,
  width = 'w-auto',
  children,
  ...props
}: CellSelectProps) {
  const id = useId();
  return (
    <>
      <select
        aria-label={label}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        className={control(error, width)}
        {...props}
      >
        {children}
      </select>
      <CellError id={`${id}-error`} error={error} />
    </>
  );
}

export const tableHead = 'px-2 py-1.5 text-left text-xs font-semibold text-ink-600';
export const tableCell = 'px-2 py-1.5 align-top text-sm text-ink-900';
