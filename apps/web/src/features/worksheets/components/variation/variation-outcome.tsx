import type { ReactNode } from 'react';
import type { VariationOutcome } from '@biasproof/calc';
import { EngineErrorNotice } from '@/features/worksheets/components/results/engine-error-notice.tsx';
import { MissingSetting } from '@/features/worksheets/components/results/missing-setting.tsx';

/** One part of the variation results: its table when it ran, else what it waits for or why it failed. */
export function OutcomeBody<T>({
  outcome,
  title,
  show,
  children,
}: {
  outcome: VariationOutcome<T> | undefined;
  /** Heading of the error notice. */
  title: string;
  show: (name: string) => string;
  children: (value: T) => ReactNode;
}) {
  if (!outcome)
    return <MissingSetting>Set up what varies above; the results appear here.</MissingSetting>;
  if (outcome.ok) return <>{children(outcome.value)}</>;
  if ('missing' in outcome) return <MissingSetting>{outcome.missing}</MissingSetting>;
  return <EngineErrorNotice title={title} error={outcome.error} show={show} />;
}

/** A titled part of a variation view. */
export function ViewSection({
  title,
  children,
  note,
}: {
  title: string;
  children: ReactNode;
  note?: ReactNode;
}) {
  const id = `variation-${title.toLowerCase().replace(/[^a-z0-9]+/g, '-')}`;
  return (
    <section aria-labelledby={id} className="flex flex-col gap-3 border-t border-rule pt-4">
      <h3 id={id} className="text-base font-bold text-ink-900">
        {title}
      </h3>
      {note ? <p className="-mt-2 text-xs text-ink-600">{note}</p> : null}
      {children}
    </section>
  );
}
