import type { z } from 'zod';
import {
  decideTransition,
  transitionAuditAction,
  type TransitionDecision,
  type transitionRequestSchema,
  type WorkflowWorksheet,
} from '@biasproof/shared';
import { AppError } from '../errors/app-error.ts';
import type { OrgContext, OrgTx } from '../orgs/org-scope.ts';
import type { Services } from '../services.ts';
import { enqueueMail } from '../outbox/outbox.ts';
import { transitionMails } from './notifications.ts';
import type { WorksheetRow } from '../db/models/worksheet.ts';
import type { RevisionRow } from '../db/models/revision.ts';
import { assertVersion, lockWorksheet, startNextRevision } from '../worksheets/guards.ts';
import { findCurrentRevisionForUpdate } from '../worksheets/repository.ts';
import { applyDraft } from '../worksheets/draft-change.ts';
import { readWorksheet, noSuchWorksheet, type WorksheetBody } from '../worksheets/worksheets.ts';
import { countOpenMajorFindings } from './repository.ts';
import { signRevision, SignaturePasswordRefused } from './signatures.ts';
import { freezeRevision, supersedeEarlierRevisions } from './revision-repository.ts';

type TransitionInput = z.output<typeof transitionRequestSchema>;

export const workflowView = (w: WorksheetRow): WorkflowWorksheet => ({
  state: w.state,
  authorId: w.authorUserId,
  checkerId: w.checkerUserId,
  approverId: w.approverUserId,
  checkedById: w.checkedByUserId,
});

function blockedError(decision: Extract<TransitionDecision, { allowed: false }>): AppError {
  return new AppError(decision.code, decision.reason);
}

/**
 * Submits the current revision: recomputes it with this server's engine (so the stored
 * results belong to the stored inputs), then freezes it. A revision already frozen (resubmitted
 * after a return without edits) stays as it was.
 */
async function freezeForCheck(tx: OrgTx, revision: RevisionRow): Promise<void> {
  if (revision.frozen) return;
  await applyDraft(tx, revision, {});
  await freezeRevision(tx, revision.id);
}

/**
 * `POST …/worksheets/:id/transitions`: one workflow step in one transaction with the worksheet
 * row locked. Order of checks: 404, the version read is current (409 stale-version), then the
 * workflow's guards (403 for role and duties, 409 for state, assignments, findings). A wrong password
 * when signing answers 403 `bad-password`, changes nothing and is audited on its own.
 */
export async function transitionWorksheet(
  org: OrgContext,
  svc: Pick<Services, 'passwords' | 'config'>,
  id: string,
  input: TransitionInput,
): Promise<WorksheetBody> {
  try {
    return await org.write(async (tx) => {
      const worksheet = await lockWorksheet(tx, id);
      // A step decided on an outdated view is moot, whoever asks: the loser of a race learns
      // that the worksheet moved on (409), not what the new state would forbid.
      assertVersion(worksheet, input.version);
      const openMajor = await countOpenMajorFindings(tx, id);
      const view = workflowView(worksheet);
      const decision = decideTransition(input.action, view, org.actor, openMajor);
      if (!decision.allowed) throw blockedError(decision);

      const revision = await findCurrentRevisionForUpdate(tx, worksheet);
      if (!revision) throw noSuchWorksheet();
      const details: Record<string, unknown> = {
        from: decision.from,
        to: decision.to,
        revision: revision.letter,
        version: worksheet.version,
        ...(input.comment ? { comment: input.comment } : {}),
      };
      let summary: string | undefined;
      let checkedBy = worksheet.checkedByUserId;
      if (input.action === 'submit') {
        await freezeForCheck(tx, revision);
        checkedBy = null;
        details.contentHash = revision.contentHash;
      } else if (input.action === 'accept') {
        checkedBy = org.actor.userId;
      } else if (input.action === 'sign') {
        Object.assign(
          details,
          await signRevision(tx, svc.passwords, {
            worksheetId: id,
            revision,
            signerId: org.actor.userId,
            meaning: input.meaning ?? '',
            password: input.password ?? '',
          }),
        );
        const superseded = await supersedeEarlierRevisions(tx, id, revision.letter);
        if (superseded.length) details.supersededRevisions = superseded;
      } else if (input.action === 'revise') {
        // The signed revision stays as it was; the next letter is a draft copy of it.
        const next = await startNextRevision(tx, worksheet, revision, org.actor.userId);
        Object.assign(details, { revision: next.letter, startedFrom: revision.letter });
        summary = `Started "${worksheet.title}" revision ${next.letter} from signed revision ${revision.letter}`;
        checkedBy = null;
      }
      await worksheet.update(
        { state: decision.to, checkedByUserId: checkedBy, version: worksheet.version + 1 },
        { transaction: tx.transaction },
      );
      await tx.audit({
        action: transitionAuditAction[input.action],
        targetType: 'worksheet',
        targetId: id,
        details,
        ...(summary ? { summary } : {}),
      });
      const actor = await tx.models.User.findByPk(org.actor.userId, {
        transaction: tx.transaction,
      });
      const mails = await transitionMails(tx, {
        action: input.action,
        worksheet,
        revision: revision.letter,
        actorName: actor?.name ?? 'Someone',
        appUrl: svc.config.appUrl,
      });
      await enqueueMail(tx, mails);
      return readWorksheet(tx, id);
    });
  } catch (error) {
    if (!(error instanceof SignaturePasswordRefused)) throw error;
    await org.write((tx) =>
      tx.audit({
        action: 'worksheet.signature-refused',
        targetType: 'worksheet',
        targetId: id,
        details: { revision: error.revision, reason: 'bad-password' },
      }),
    );
    throw new AppError('bad-password', 'The password is not correct; nothing was signed.');
  }
}
