import type { ReactNode } from 'react';

/** A list with nothing in it: says so, and what to do next. */
export function EmptyState({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <div className="rounded-md border border-dashed border-ink-300 px-6 py-10 text-center">
      <p className="font-semibold text-ink-900">{title}</p>
      {children ? <div className="mt-1 text-sm text-ink-600">{children}</div> : null}
    </div>
  );
}
