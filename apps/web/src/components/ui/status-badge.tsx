import type { ReactNode } from 'react';

export type StatusTone = 'ok' | 'fault' | 'pending';

const toneClasses: Record<StatusTone, { badge: string; dot: string }> = {
  ok: { badge: 'bg-ok-tint text-ok', dot: 'bg-ok' },
  fault: { badge: 'bg-fault-tint text-fault', dot: 'bg-fault' },
  pending: { badge: 'bg-pending-tint text-pending', dot: 'bg-pending animate-pulse' },
};

interface StatusBadgeProps {
  tone: StatusTone;
  /** Accessible name of the live region; the visible text should be part of it. */
  label: string;
  children: ReactNode;
  title?: string;
}

/** A small pill whose changes are announced politely to screen readers (role="status"). */
export function StatusBadge({ tone, label, children, title }: StatusBadgeProps) {
  const classes = toneClasses[tone];
  return (
    <p
      role="status"
      aria-label={label}
      title={title}
      className={`inline-flex items-center gap-2 rounded-full px-3 py-1 text-sm font-semibold ${classes.badge}`}
    >
      <span aria-hidden="true" className={`size-2 rounded-full ${classes.dot}`} />
      {children}
    </p>
  );
}
