import { useCallback, useMemo } from 'react';
import type { DeviceModel } from '@biasproof/calc';
import { editableWorksheetStates, subject, type Worksheet } from '@biasproof/shared';
import { TextLink } from '@/components/ui/text-link.tsx';
import { useModelLibrary } from '@/features/worksheets/api/list-models.ts';
import { ConflictDialog } from '@/features/worksheets/components/page/conflict-dialog.tsx';
import { LeaveGuard } from '@/features/worksheets/components/page/leave-guard.tsx';
import { SaveIndicator } from '@/features/worksheets/components/page/save-indicator.tsx';
import type {
  WorksheetSlotContext,
  WorksheetSlots,
  WorksheetSlotsComponent,
} from '@/features/worksheets/components/page/worksheet-slots.ts';
import { StateChip, stateLabel } from '@/features/worksheets/components/state-chip.tsx';
import {
  WorksheetWorkspace,
  type StoredResults,
} from '@/features/worksheets/components/worksheet-workspace.tsx';
import { draftOf, useAutosave } from '@/features/worksheets/hooks/use-autosave.ts';
import { useAppAbility } from '@/lib/ability.tsx';
import { orgPath, useCurrentOrg } from '@/lib/current-org.tsx';

/** Why a worksheet is shown read-only, or null when this person may edit it. */
function readOnlyReason(worksheet: Worksheet, mayUpdate: boolean): string | null {
  if (!editableWorksheetStates.includes(worksheet.state)) {
    return `This worksheet is ${stateLabel(worksheet.state).toLowerCase()}: revision ${worksheet.revision} can no longer change.`;
  }
  if (!mayUpdate) return `Only its author, ${worksheet.author.name}, edits this worksheet.`;
  return null;
}

/**
 * A worksheet loaded from the server: the editor starts from its current revision, edits are
 * previewed in the browser and saved after a pause; the results say whether they are the
 * stored ones or a local preview.
 */
export function StoredWorksheet({
  worksheet: initial,
  onReload,
  slots: Slots,
}: {
  worksheet: Worksheet;
  /** Reads the worksheet again and starts this page afresh from it. */
  onReload: () => Promise<void>;
  /** What the app plugs into the page (see worksheet-slots.ts). */
  slots?: WorksheetSlotsComponent | undefined;
}) {
  const { membership, user } = useCurrentOrg();
  const ability = useAppAbility();
  const mayUpdate = ability.can('update', subject('Worksheet', { authorId: initial.author.id }));
  const readOnly = readOnlyReason(initial, mayUpdate);
  const autosave = useAutosave(membership.orgId, initial, readOnly === null);
  const { worksheet, key } = autosave.saved;
  const library = useModelLibrary(membership.orgId);

  const initialDraft = useCallback(() => draftOf(initial), [initial]);
  const libraryModels = useMemo<DeviceModel[] | undefined>(
    () => library.data?.items.map(({ name, kind, params }) => ({ name, kind, params })),
    [library.data],
  );
  const revision = worksheet.currentRevision;
  const stored = useMemo<StoredResults>(
    () => ({
      key,
      results: revision.results,
      from: {
        letter: revision.letter,
        engineVersion: revision.engineVersion,
        contentHash: revision.contentHash,
      },
    }),
    [key, revision],
  );

  const unsavedEdits = autosave.status !== 'saved';
  const context = useMemo<WorksheetSlotContext>(
    () => ({ worksheet, unsavedEdits, reload: onReload }),
    [worksheet, unsavedEdits, onReload],
  );

  const page = (slots: WorksheetSlots) => (
    <>
      <title>{`${worksheet.title} · ${membership.orgName} · Biasproof`}</title>
      <LeaveGuard when={autosave.status !== 'saved'} />
      {autosave.status === 'conflict' ? (
        <ConflictDialog
          message={autosave.problem}
          onLoadTheirs={onReload}
          onKeepMine={autosave.keepMine}
        />
      ) : null}
      <WorksheetWorkspace
        initialDraft={initialDraft}
        readOnly={readOnly !== null}
        stored={stored}
        library={libraryModels}
        onDraftChange={autosave.onDraft}
        sidePanel={slots.sidePanel}
        resultMarks={{ annotations: slots.numberAnnotations, onActivate: slots.onNumberActivate }}
        heading={() => (
          <div className="flex flex-col gap-2">
            <p className="text-sm font-semibold text-ink-600">
              <TextLink to={orgPath(membership.orgSlug, `projects/${worksheet.projectId}`)}>
                {worksheet.projectCode} · {worksheet.projectName}
              </TextLink>
            </p>
            <h1 className="text-3xl font-bold text-ink-900">{worksheet.title}</h1>
            <div className="flex flex-wrap items-center gap-x-4 gap-y-2 text-sm text-ink-700">
              <StateChip state={worksheet.state} />
              <span>
                Revision <strong className="font-mono">{worksheet.revision}</strong>
              </span>
              <span>Author: {worksheet.author.id === user.id ? 'you' : worksheet.author.name}</span>
              {readOnly === null ? (
                <SaveIndicator
                  status={autosave.status}
                  problem={autosave.problem}
                  onRetry={autosave.retry}
                />
              ) : null}
            </div>
            {worksheet.description ? (
              <p className="max-w-3xl text-ink-700">{worksheet.description}</p>
            ) : null}
            {readOnly ? (
              <p
                role="note"
                className="rounded-md border border-ink-300 bg-paper px-3 py-2 text-sm font-semibold text-ink-700"
              >
                Read only. {readOnly}
              </p>
            ) : null}
            {slots.actionBar}
          </div>
        )}
      />
    </>
  );
  return Slots ? <Slots context={context}>{page}</Slots> : page({});
}
