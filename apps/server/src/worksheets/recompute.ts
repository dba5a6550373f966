import type { OrgContext } from '../orgs/org-scope.ts';
import { applyDraft } from './draft-change.ts';
import { assertMayEdit, lockEditableRevision, lockWorksheet } from './guards.ts';
import { saveWorksheet } from './repository.ts';
import { readWorksheet, type WorksheetBody } from './worksheets.ts';

/**
 * `POST …/worksheets/:id/compute`: recomputes the current (draft) revision with this server's
 * engine and stores the results, the engine version and the content hash. Idempotent: when
 * the same inputs give the same results with the same engine, nothing is written.
 */
export async function recomputeWorksheet(org: OrgContext, id: string): Promise<WorksheetBody> {
  return org.write(async (tx) => {
    const worksheet = await lockWorksheet(tx, id);
    assertMayEdit(org, worksheet);
    const revision = await lockEditableRevision(tx, worksheet);
    const previousHash = revision.contentHash;
    const previousEngine = revision.engineVersion;
    const { computed } = await applyDraft(tx, revision, {});
    if (!computed) return readWorksheet(tx, id);
    await saveWorksheet(tx, worksheet, { version: worksheet.version + 1 });
    await tx.audit({
      action: 'worksheet.computed',
      targetType: 'worksheet',
      targetId: id,
      details: {
        version: worksheet.version,
        revision: revision.letter,
        contentHash: computed.contentHash,
        previousHash,
        engineVersion: computed.engineVersion,
        previousEngineVersion: previousEngine,
        resultStatus: computed.resultStatus,
      },
    });
    return readWorksheet(tx, id);
  });
}
