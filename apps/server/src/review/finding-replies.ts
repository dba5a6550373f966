import { subject, type Finding } from '@biasproof/shared';
import { AppError } from '../errors/app-error.ts';
import type { OrgContext } from '../orgs/org-scope.ts';
import { enqueueMail } from '../outbox/outbox.ts';
import { lockWorksheet } from '../worksheets/guards.ts';
import { findingMails, mailFinding } from './finding-notifications.ts';
import { noSuchFinding } from './findings.ts';
import { insertReply, lockFinding, readFinding } from './repository.ts';

/**
 * `POST …/findings/:findingId/replies`: a comment in the thread that moves nothing (the status
 * stays). The worksheet's author, checkers and approvers may write one; the other party of the
 * thread is told by e-mail.
 */
export async function replyToFinding(
  org: OrgContext,
  appUrl: string,
  findingId: string,
  text: string,
): Promise<Finding> {
  return org.write(async (tx) => {
    const finding = await lockFinding(tx, findingId);
    if (!finding) throw noSuchFinding();
    const worksheet = await lockWorksheet(tx, finding.worksheet_id);
    if (
      !org.ability.can('reply', subject('Finding', { worksheetAuthorId: worksheet.authorUserId }))
    ) {
      throw new AppError(
        'forbidden',
        'Only the author of the worksheet, a checker or an approver may reply to this finding.',
      );
    }
    const replyId = await insertReply(tx, findingId, {
      kind: 'reply',
      text,
      userId: org.actor.userId,
    });
    await tx.audit({
      action: 'finding.replied',
      targetType: 'finding',
      targetId: findingId,
      summary:
        `Replied on the ${finding.severity} finding on ${finding.path} of ` +
        `"${worksheet.title}" revision ${finding.revision_letter}`,
      details: {
        worksheetId: finding.worksheet_id,
        revision: finding.revision_letter,
        path: finding.path,
        status: finding.status,
        replyId,
      },
    });
    await enqueueMail(
      tx,
      await findingMails(
        tx,
        { kind: 'replied', text },
        { finding: mailFinding(finding), worksheet, actorId: org.actor.userId, appUrl },
      ),
    );
    return (await readFinding(tx, findingId))!;
  });
}
