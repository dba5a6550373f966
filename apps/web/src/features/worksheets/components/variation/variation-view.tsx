import type { SolvedWorksheet } from '@biasproof/calc';
import { useState } from 'react';
import { SelectField } from '@/components/ui/select-field.tsx';
import { MonteCarloPanel } from '@/features/worksheets/components/variation/monte-carlo-panel.tsx';
import { SensitivitySection } from '@/features/worksheets/components/variation/sensitivity-section.tsx';
import { StandardValuesSection } from '@/features/worksheets/components/variation/standard-values-section.tsx';
import { StressSection } from '@/features/worksheets/components/variation/stress-section.tsx';
import {
  CornersTable,
  TemperatureTable,
} from '@/features/worksheets/components/variation/sweep-and-corners.tsx';
import type { MonteCarloRun } from '@/features/worksheets/components/variation/use-monte-carlo-run.ts';
import {
  followedPaths,
  variationOf,
  type VariationEditing,
} from '@/features/worksheets/components/variation/variation-draft.ts';
import {
  OutcomeBody,
  ViewSection,
} from '@/features/worksheets/components/variation/variation-outcome.tsx';
import { VariationSetup } from '@/features/worksheets/components/variation/variation-setup.tsx';

/**
 * Tolerances, temperatures and ratings, and what they do to the results: temperature sweep,
 * corners, sensitivities and RSS, Monte Carlo, part stress and standard values. Everything but
 * Monte Carlo is recomputed with the other results as the author types; Monte Carlo runs on
 * request, in a worker.
 */
export function VariationView({
  results,
  editing,
  monteCarlo,
  show,
}: {
  results: SolvedWorksheet;
  editing: VariationEditing;
  monteCarlo: MonteCarloRun;
  show: (name: string) => string;
}) {
  const { draft, edit, readOnly } = editing;
  const v = results.variation;
  const paths = followedPaths(variationOf(draft.settings));
  const [chosenPath, setChosenPath] = useState('');
  const shownPath = paths.includes(chosenPath) ? chosenPath : (paths[0] ?? '');
  const rss = v?.rss.ok ? v.rss.value : null;

  return (
    <div className="flex flex-col gap-6">
      <section aria-labelledby="variation-setup" className="flex flex-col gap-3">
        <h3 id="variation-setup" className="text-base font-bold text-ink-900">
          What varies
        </h3>
        <VariationSetup
          circuit={draft.circuit}
          settings={draft.settings}
          edit={edit}
          readOnly={readOnly}
        />
      </section>

      {paths.length > 1 ? (
        <SelectField
          label="Result in the charts"
          value={shownPath}
          onChange={(e) => setChosenPath(e.currentTarget.value)}
          className="sm:max-w-xs"
        >
          {paths.map((p) => (
            <option key={p} value={p}>
              {p}
            </option>
          ))}
        </SelectField>
      ) : null}

      <ViewSection title="Monte Carlo">
        <MonteCarloPanel editing={editing} results={v} run={monteCarlo} shownPath={shownPath} />
      </ViewSection>

      <ViewSection title="Corners">
        <OutcomeBody outcome={v?.corners} title="The corners could not be run" show={show}>
          {(corners) => <CornersTable corners={corners} rss={rss} show={show} />}
        </OutcomeBody>
      </ViewSection>

      <ViewSection title="Sensitivities and RSS">
        <OutcomeBody outcome={v?.rss} title="The sensitivities could not be found" show={show}>
          {(value) => <SensitivitySection rss={value} shownPath={shownPath} show={show} />}
        </OutcomeBody>
      </ViewSection>

      <ViewSection title="Temperature sweep">
        <OutcomeBody outcome={v?.temperatures} title="The sweep could not be run" show={show}>
          {(sweep) => <TemperatureTable sweep={sweep} />}
        </OutcomeBody>
      </ViewSection>

      <ViewSection title="Part stress">
        <OutcomeBody outcome={v?.stress} title="Stress could not be checked" show={show}>
          {(stress) => <StressSection stress={stress} show={show} />}
        </OutcomeBody>
      </ViewSection>

      <ViewSection title="Standard values">
        <OutcomeBody
          outcome={v?.standardValues}
          title="Standard values could not be checked"
          show={show}
        >
          {(suggestions) => (
            <StandardValuesSection
              suggestions={suggestions}
              circuit={draft.circuit}
              edit={edit}
              readOnly={readOnly}
              show={show}
            />
          )}
        </OutcomeBody>
      </ViewSection>
    </div>
  );
}
