import { worksheetDraftSchema, type WorksheetDraft } from '@biasproof/calc';
import { canonicalJson } from '@biasproof/shared';
import { AppError } from '../errors/app-error.ts';
import type { OrgTx } from '../orgs/org-scope.ts';
import type { RevisionRow } from '../db/models/revision.ts';
import { computeRevision, type ComputedRevision } from '../calc/compute.ts';
import { saveRevisionContent } from './repository.ts';

/** The revision's stored draft, validated again (and defaults filled) by today's engine schema. */
export function storedDraft(
  revision: Pick<RevisionRow, 'letter' | 'circuit' | 'settings'>,
): WorksheetDraft {
  const parsed = worksheetDraftSchema.safeParse({
    circuit: revision.circuit,
    settings: revision.settings,
  });
  if (!parsed.success) {
    throw new AppError(
      'unprocessable',
      `The stored circuit of revision ${revision.letter} no longer passes the engine's checks: ` +
        `${parsed.error.issues[0]?.message ?? 'invalid'}. Import or edit the circuit again.`,
    );
  }
  return parsed.data;
}

export interface DraftChange {
  /** Which of `circuit` and `settings` differ from what was stored. */
  changed: ('circuit' | 'settings')[];
  /** The new stored content, when anything in it changed (inputs, results or engine version). */
  computed?: ComputedRevision;
}

/**
 * Recomputes the revision from the new circuit and/or settings (the stored ones where absent)
 * and stores the results with the engine version and content hash when anything changed.
 * The same inputs give the same results and hash, so an unchanged draft writes nothing.
 */
export async function applyDraft(
  tx: OrgTx,
  revision: RevisionRow,
  next: Partial<WorksheetDraft>,
): Promise<DraftChange> {
  const current = storedDraft(revision);
  const draft: WorksheetDraft = {
    circuit: next.circuit ?? current.circuit,
    settings: next.settings ?? current.settings,
  };
  const differs = (a: unknown, b: unknown) => canonicalJson(a) !== canonicalJson(b);
  const changed: DraftChange['changed'] = [];
  if (differs(draft.circuit, revision.circuit)) changed.push('circuit');
  if (differs(draft.settings, revision.settings)) changed.push('settings');
  const computed = computeRevision(draft);
  if (
    computed.contentHash === revision.contentHash &&
    computed.engineVersion === revision.engineVersion
  ) {
    return { changed };
  }
  await saveRevisionContent(tx, revision, computed);
  return { changed, computed };
}
