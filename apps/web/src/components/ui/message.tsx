import type { ReactNode } from 'react';

interface MessageProps {
  children: ReactNode;
  className?: string;
}

/** A problem the person must read now (announced at once by screen readers). */
export function ErrorMessage({ children, className = '' }: MessageProps) {
  return (
    <p
      role="alert"
      className={`rounded-md border border-fault bg-fault-tint px-3 py-2 text-sm font-semibold text-fault ${className}`}
    >
      {children}
    </p>
  );
}

/** Good news or a confirmation (announced politely). */
export function SuccessMessage({ children, className = '' }: MessageProps) {
  return (
    <p
      role="status"
      className={`rounded-md border border-ok bg-ok-tint px-3 py-2 text-sm font-semibold text-ok ${className}`}
    >
      {children}
    </p>
  );
}

/** Shown while an answer is on its way. */
export function LoadingMessage({ children }: { children: ReactNode }) {
  return (
    <p role="status" className="text-sm text-ink-600">
      {children}
    </p>
  );
}
