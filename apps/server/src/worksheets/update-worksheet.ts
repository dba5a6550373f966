import type { z } from 'zod';
import type { updateWorksheetRequestSchema } from '@biasproof/shared';
import type { OrgContext } from '../orgs/org-scope.ts';
import type { WorksheetRow } from '../db/models/worksheet.ts';
import { assertAssignees } from './assignees.ts';
import { applyDraft, type DraftChange } from './draft-change.ts';
import {
  assertMayAssign,
  assertMayEdit,
  assertVersion,
  lockEditableRevision,
  lockWorksheet,
} from './guards.ts';
import { saveWorksheet } from './repository.ts';
import { readWorksheet, type WorksheetBody } from './worksheets.ts';

type UpdateInput = z.output<typeof updateWorksheetRequestSchema>;
type WorksheetChanges = Partial<
  Pick<WorksheetRow, 'title' | 'description' | 'checkerUserId' | 'approverUserId'>
>;

/** The worksheet's own fields that the request changes, by their API names. */
function fieldChanges(worksheet: WorksheetRow, input: UpdateInput) {
  const changes: WorksheetChanges = {};
  const names: string[] = [];
  const pairs = [
    ['title', 'title', input.title],
    ['description', 'description', input.description],
    ['checkerId', 'checkerUserId', input.checkerId],
    ['approverId', 'approverUserId', input.approverId],
  ] as const;
  for (const [name, column, value] of pairs) {
    if (value !== undefined && value !== worksheet[column]) {
      Object.assign(changes, { [column]: value });
      names.push(name);
    }
  }
  return { changes, names };
}

/**
 * Saves an author's edits and/or an assignment, with optimistic locking on `version`. A new
 * circuit or new settings are recomputed here, so the stored results always belong to the
 * stored inputs. Nothing changed → nothing written, no new version, no audit event.
 */
export async function updateWorksheet(
  org: OrgContext,
  id: string,
  input: UpdateInput,
): Promise<WorksheetBody> {
  return org.write(async (tx) => {
    const worksheet = await lockWorksheet(tx, id);
    const edits = [input.title, input.description, input.circuit, input.settings].some(
      (v) => v !== undefined,
    );
    const assigns = input.checkerId !== undefined || input.approverId !== undefined;
    if (edits) assertMayEdit(org, worksheet);
    if (assigns) assertMayAssign(org, worksheet);
    assertVersion(worksheet, input.version);
    const startedFrom = worksheet.currentRevision;
    const revision = edits
      ? await lockEditableRevision(tx, worksheet, { startNextBy: org.actor.userId })
      : null;
    // A returned worksheet's first edit starts the next revision: a change even if nothing else is.
    const started = revision !== null && revision.letter !== startedFrom;
    if (assigns) await assertAssignees(tx, worksheet, input);

    const before = { checkerId: worksheet.checkerUserId, approverId: worksheet.approverUserId };
    const { changes, names } = fieldChanges(worksheet, input);
    let draft: DraftChange = { changed: [] };
    if (revision && (input.circuit || input.settings)) {
      draft = await applyDraft(tx, revision, { circuit: input.circuit, settings: input.settings });
    }
    const changed = [...names, ...draft.changed];
    if (changed.length === 0 && !draft.computed && !started) return readWorksheet(tx, id);

    await saveWorksheet(tx, worksheet, { ...changes, version: worksheet.version + 1 });
    const onlyAssignment = changed.every((n) => n === 'checkerId' || n === 'approverId');
    await tx.audit({
      action: onlyAssignment && changed.length > 0 ? 'worksheet.assigned' : 'worksheet.updated',
      targetType: 'worksheet',
      targetId: id,
      details: {
        version: worksheet.version,
        revision: worksheet.currentRevision,
        changed,
        ...(started ? { startedFrom } : {}),
        ...(assigns
          ? {
              before,
              after: { checkerId: worksheet.checkerUserId, approverId: worksheet.approverUserId },
            }
          : {}),
        ...(draft.computed
          ? {
              contentHash: draft.computed.contentHash,
              engineVersion: draft.computed.engineVersion,
              resultStatus: draft.computed.resultStatus,
            }
          : {}),
      },
    });
    return readWorksheet(tx, id);
  });
}
