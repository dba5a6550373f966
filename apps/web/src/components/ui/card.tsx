import type { ComponentProps } from 'react';

export function Card({ className = '', ...props }: ComponentProps<'section'>) {
  return (
    <section
      className={`rounded-lg border border-rule bg-surface p-6 shadow-sm ${className}`}
      {...props}
    />
  );
}
