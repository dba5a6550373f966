import { useEffect, useState } from 'react';
import { worksheetStates, type PersonRef, type Project } from '@biasproof/shared';
import { SelectField } from '@/components/ui/select-field.tsx';
import { TextField } from '@/components/ui/text-field.tsx';
import { stateLabel } from '@/features/worksheets/components/state-chip.tsx';
import type { ListParams } from '@/features/worksheets/components/list/list-params.ts';
import { useDebouncedValue } from '@/features/worksheets/hooks/use-debounced-value.ts';

/** Typing in the search box asks the server once the typing pauses this long. */
export const SEARCH_DEBOUNCE_MS = 300;

interface WorksheetFiltersProps {
  params: ListParams;
  update: (change: Partial<ListParams>) => void;
  /** Projects to filter by; absent on a project's own page. */
  projects?: readonly Project[] | undefined;
  /** Authors seen so far, offered in the author filter besides "Me". */
  authors: readonly PersonRef[];
  userId: string;
}

export function WorksheetFilters({
  params,
  update,
  projects,
  authors,
  userId,
}: WorksheetFiltersProps) {
  const [text, setText] = useState(params.q);
  const settled = useDebouncedValue(text.trim(), SEARCH_DEBOUNCE_MS);
  useEffect(() => {
    if (settled !== params.q) update({ q: settled });
    // Only a new settled text asks again; params changing otherwise must not re-send it.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [settled]);

  return (
    <div
      role="search"
      aria-label="Filter worksheets"
      className="flex flex-wrap items-end gap-x-4 gap-y-3"
    >
      <TextField
        label="Search title and description"
        type="search"
        className="min-w-56 flex-1"
        value={text}
        onChange={(e) => setText(e.currentTarget.value)}
      />
      {projects ? (
        <SelectField
          label="Project"
          value={params.projectId}
          onChange={(e) => update({ projectId: e.currentTarget.value })}
        >
          <option value="">All projects</option>
          {projects.map((p) => (
            <option key={p.id} value={p.id}>
              {p.code} · {p.name}
            </option>
          ))}
        </SelectField>
      ) : null}
      <SelectField
        label="State"
        value={params.state}
        onChange={(e) => update({ state: e.currentTarget.value as ListParams['state'] })}
      >
        <option value="">Any state</option>
        {worksheetStates.map((s) => (
          <option key={s} value={s}>
            {stateLabel(s)}
          </option>
        ))}
      </SelectField>
      <SelectField
        label="Author"
        value={params.author}
        onChange={(e) => update({ author: e.currentTarget.value })}
      >
        <option value="">Anyone</option>
        <option value="me">Me</option>
        {authors
          .filter((a) => a.id !== userId)
          .map((a) => (
            <option key={a.id} value={a.id}>
              {a.name}
            </option>
          ))}
      </SelectField>
      <label className="flex items-center gap-2 pb-2 text-sm font-semibold text-ink-700">
        <input
          type="checkbox"
          checked={params.assignedToMe}
          onChange={(e) => update({ assignedToMe: e.currentTarget.checked })}
          className="size-4 accent-accent"
        />
        Assigned to me
      </label>
    </div>
  );
}
