import type { ReactNode } from 'react';
import { Chip } from '@/features/worksheets/components/results/result-cells.tsx';

export type CheckStatus = 'pass' | 'warn' | 'fail' | 'unrated';

/** Each status with an icon and a word, so that it never rests on colour alone. */
export const statusLooks: Record<
  CheckStatus,
  { icon: string; word: string; tone: 'ok' | 'caution' | 'fault' | 'neutral' }
> = {
  pass: { icon: '✓', word: 'Pass', tone: 'ok' },
  warn: { icon: '⚠', word: 'Warn', tone: 'caution' },
  fail: { icon: '✗', word: 'Fail', tone: 'fault' },
  unrated: { icon: '–', word: 'Unrated', tone: 'neutral' },
};

export function StatusChip({
  status,
  path,
  title,
  children,
}: {
  status: CheckStatus;
  path?: string;
  title?: string;
  /** Said after the word, e.g. the margin. */
  children?: ReactNode;
}) {
  const look = statusLooks[status];
  return (
    <Chip tone={look.tone} path={path} title={title}>
      <span aria-hidden="true">{look.icon}</span> {look.word}
      {children ? <> {children}</> : null}
    </Chip>
  );
}
