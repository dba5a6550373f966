import { createContext, useContext, type ReactNode } from 'react';

/** Markers and activation the page lays over result numbers (findings, in the review). */
export interface ResultMarks {
  /** Path → what its marker stands for, e.g. "1 open finding". */
  annotations?: ReadonlyMap<string, string> | undefined;
  /** When set, numbers with a path are buttons that call it. */
  onActivate?: ((path: string) => void) | undefined;
}

const ResultMarksContext = createContext<ResultMarks>({});

export function ResultMarksProvider({
  marks,
  children,
}: {
  marks: ResultMarks;
  children: ReactNode;
}) {
  return <ResultMarksContext value={marks}>{children}</ResultMarksContext>;
}

/** The marker text and the activation of one result path (both absent for most numbers). */
export function useResultMark(path: string | undefined): {
  annotation: string | undefined;
  activate: (() => void) | undefined;
} {
  const { annotations, onActivate } = useContext(ResultMarksContext);
  if (!path) return { annotation: undefined, activate: undefined };
  return {
    annotation: annotations?.get(path),
    activate: onActivate ? () => onActivate(path) : undefined,
  };
}

/**
 * A number (or chip) as the reviewer sees it: with a visible flag and its words when it has
 * findings, and as a button when findings may be raised on it.
 */
export function MarkedResult({
  path,
  title,
  className,
  children,
}: {
  path: string | undefined;
  title?: string | undefined;
  className: string;
  children: ReactNode;
}) {
  const { annotation, activate } = useResultMark(path);
  const marker = annotation ? (
    <span
      className="ml-1 inline-flex items-center rounded-sm border border-pending bg-pending-tint px-1 text-[0.7rem] font-bold text-pending"
      title={annotation}
    >
      <span aria-hidden="true">⚑</span>
      <span className="sr-only">({annotation})</span>
    </span>
  ) : null;
  // The path stays on a span holding the number alone, so reading it gives the number only.
  const number = (
    <span data-result-path={path} title={activate ? undefined : title} className={className}>
      {children}
    </span>
  );
  if (activate) {
    return (
      <button
        type="button"
        title={title ? `${title} · raise a finding on ${path}` : `Raise a finding on ${path}`}
        onClick={activate}
        className="cursor-pointer rounded-sm text-left underline decoration-dotted underline-offset-4 hover:bg-accent-tint focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-accent"
      >
        {number}
        <span className="sr-only">, raise a finding on {path}</span>
        {marker}
      </button>
    );
  }
  return marker ? (
    <span className="whitespace-nowrap">
      {number}
      {marker}
    </span>
  ) : (
    number
  );
}
