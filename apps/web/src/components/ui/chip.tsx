import type { ReactNode } from 'react';

export type ChipTone = 'neutral' | 'accent' | 'ok' | 'fault' | 'pending';

const toneClasses: Record<ChipTone, string> = {
  neutral: 'bg-paper text-ink-700 ring-1 ring-inset ring-ink-300',
  accent: 'bg-accent-tint text-accent-strong',
  ok: 'bg-ok-tint text-ok',
  fault: 'bg-fault-tint text-fault',
  pending: 'bg-pending-tint text-pending',
};

/** A small rounded label for a state or a kind, e.g. in a table cell. */
export function Chip({
  tone = 'neutral',
  title,
  children,
}: {
  tone?: ChipTone;
  title?: string;
  children: ReactNode;
}) {
  return (
    <span
      title={title}
      className={`inline-block whitespace-nowrap rounded-full px-2.5 py-0.5 text-xs font-semibold ${toneClasses[tone]}`}
    >
      {children}
    </span>
  );
}
