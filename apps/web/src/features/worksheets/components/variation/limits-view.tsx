import type { HandCheck, Limit, SolvedWorksheet } from '@biasproof/calc';
import { useId, useMemo, useState } from 'react';
import { Button } from '@/components/ui/button.tsx';
import {
  HandCheckForm,
  LimitForm,
} from '@/features/worksheets/components/variation/check-forms.tsx';
import { HandCheckTable } from '@/features/worksheets/components/variation/hand-check-table.tsx';
import { LimitTable } from '@/features/worksheets/components/variation/limit-table.tsx';
import { shownMonteCarlo } from '@/features/worksheets/components/variation/shown-monte-carlo.ts';
import {
  useMonteCarloState,
  type MonteCarloRun,
} from '@/features/worksheets/components/variation/use-monte-carlo-run.ts';
import {
  variationEdit,
  variationOf,
  type VariationEditing,
} from '@/features/worksheets/components/variation/variation-draft.ts';
import { ViewSection } from '@/features/worksheets/components/variation/variation-outcome.tsx';
import { knownResultPaths } from '@/features/worksheets/components/variation/variation-targets.ts';

type OpenForm = { kind: 'limit' | 'check'; index: number | null } | null;

/** Without the one at `index`, or with `item` put at `index` (appended when index is null). */
function replaced<T>(list: readonly T[], index: number | null, item?: T): T[] {
  if (item === undefined) return list.filter((_, i) => i !== index);
  return index === null ? [...list, item] : list.map((x, i) => (i === index ? item : x));
}

/**
 * The limits a result must meet (pass/fail with margins at nominal and at the worst corner, and
 * the Monte Carlo yield) and the author's hand-calculated values beside the engine's.
 */
export function LimitsView({
  results,
  editing,
  monteCarlo,
}: {
  results: SolvedWorksheet;
  editing: VariationEditing;
  monteCarlo: MonteCarloRun;
}) {
  const { draft, edit, readOnly } = editing;
  const v = variationOf(draft.settings);
  const pathListId = useId();
  const paths = useMemo(() => knownResultPaths(results), [results]);
  const [open, setOpen] = useState<OpenForm>(null);
  const computed = results.variation;
  const runState = useMonteCarloState(monteCarlo);
  const shown = shownMonteCarlo(draft, computed, runState);

  // The results may still be those of the draft before the last edit: pair by content, not index.
  const reports = v.limits.map((l, i) => {
    const r = computed?.limits[i];
    return r && r.nominal.path === l.path && r.nominal.min === l.min && r.nominal.max === l.max
      ? r
      : null;
  });
  const yields = v.limits.map((l, i) => {
    const y = shown?.result.yield?.limits[i];
    return y && y.path === l.path && y.min === l.min && y.max === l.max ? y : null;
  });
  const checkResults = v.handChecks.map((c, i) => {
    const r = computed?.handChecks[i];
    return r && r.path === c.path && r.expected === c.expected ? r : null;
  });

  const saveLimits = (limits: Limit[]) => edit(variationEdit(draft.settings, { limits }));
  const saveChecks = (handChecks: HandCheck[]) =>
    edit(variationEdit(draft.settings, { handChecks }));

  return (
    <div className="flex flex-col gap-6">
      <datalist id={pathListId}>
        {paths.map((p) => (
          <option key={p} value={p} />
        ))}
      </datalist>
      <ViewSection
        title="Limits"
        note="Pass or fail with the margin to the nearer bound, at nominal and at the worst tolerance corner; the yield counts the Monte Carlo samples within the limit."
      >
        {v.limits.length === 0 ? (
          <p className="text-sm text-ink-600">No limits yet.</p>
        ) : (
          <LimitTable
            limits={v.limits}
            reports={reports}
            yields={yields}
            samples={shown?.result.samples ?? null}
            readOnly={readOnly}
            onEdit={(index) => setOpen({ kind: 'limit', index })}
            onDelete={(index) => saveLimits(replaced(v.limits, index))}
          />
        )}
        {open?.kind === 'limit' && !readOnly ? (
          <LimitForm
            key={`limit-${open.index}`}
            title={
              open.index === null
                ? 'New limit'
                : `Edit the limit on ${v.limits[open.index]?.path ?? ''}`
            }
            initial={open.index === null ? undefined : v.limits[open.index]}
            pathListId={pathListId}
            onCancel={() => setOpen(null)}
            onSave={(limit) => {
              saveLimits(replaced(v.limits, open.index, limit));
              setOpen(null);
            }}
          />
        ) : readOnly ? null : (
          <div>
            <Button variant="outline" onClick={() => setOpen({ kind: 'limit', index: null })}>
              Add limit
            </Button>
          </div>
        )}
      </ViewSection>

      <ViewSection
        title="Hand-calc checks"
        note="Your hand-calculated value of a result: the engine's deviation from it, in % of your value, against the tolerance you accept."
      >
        {v.handChecks.length === 0 ? (
          <p className="text-sm text-ink-600">No hand checks yet.</p>
        ) : (
          <HandCheckTable
            checks={v.handChecks}
            results={checkResults}
            readOnly={readOnly}
            onEdit={(index) => setOpen({ kind: 'check', index })}
            onDelete={(index) => saveChecks(replaced(v.handChecks, index))}
          />
        )}
        {open?.kind === 'check' && !readOnly ? (
          <HandCheckForm
            key={`check-${open.index}`}
            title={
              open.index === null
                ? 'New hand check'
                : `Edit the hand check of ${v.handChecks[open.index]?.path ?? ''}`
            }
            initial={open.index === null ? undefined : v.handChecks[open.index]}
            pathListId={pathListId}
            onCancel={() => setOpen(null)}
            onSave={(check) => {
              saveChecks(replaced(v.handChecks, open.index, check));
              setOpen(null);
            }}
          />
        ) : readOnly ? null : (
          <div>
            <Button variant="outline" onClick={() => setOpen({ kind: 'check', index: null })}>
              Add hand check
            </Button>
          </div>
        )}
      </ViewSection>
    </div>
  );
}
