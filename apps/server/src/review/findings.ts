import type { z } from 'zod';
import { subject, type createFindingRequestSchema, type Finding } from '@biasproof/shared';
import { AppError } from '../errors/app-error.ts';
import type { OrgContext, OrgTx } from '../orgs/org-scope.ts';
import { enqueueMail } from '../outbox/outbox.ts';
import { findWorksheet } from '../worksheets/repository.ts';
import { lockWorksheet } from '../worksheets/guards.ts';
import { noSuchWorksheet } from '../worksheets/worksheets.ts';
import { findingMails, mailFinding } from './finding-notifications.ts';
import {
  insertFinding,
  listFindings,
  lockFinding,
  readFinding,
  setFindingStatus,
} from './repository.ts';

export const noSuchFinding = () =>
  new AppError('not-found', 'No such finding in this organization');

export async function assertWorksheetExists(tx: OrgTx, id: string): Promise<void> {
  if (!(await findWorksheet(tx, id))) throw noSuchWorksheet();
}

export async function getFindings(org: OrgContext, worksheetId: string) {
  return org.read(async (tx) => {
    await assertWorksheetExists(tx, worksheetId);
    const items = await listFindings(tx, worksheetId);
    return { items, total: items.length };
  });
}

/** A checker raises a finding on the current revision of a worksheet in check or checked; its author is told. */
export async function raiseFinding(
  org: OrgContext,
  appUrl: string,
  worksheetId: string,
  input: z.output<typeof createFindingRequestSchema>,
): Promise<Finding> {
  return org.write(async (tx) => {
    const worksheet = await lockWorksheet(tx, worksheetId);
    if (
      !org.ability.can('create', subject('Finding', { worksheetAuthorId: worksheet.authorUserId }))
    ) {
      throw new AppError(
        'forbidden',
        'Only a checker other than the author may raise findings here.',
      );
    }
    if (worksheet.state !== 'in_check' && worksheet.state !== 'checked') {
      throw new AppError(
        'conflict',
        'Findings are raised while a worksheet is in check or checked, not when it is ' +
          `${worksheet.state.replace('_', ' ')}.`,
      );
    }
    const id = await insertFinding(tx, {
      worksheetId,
      revision: worksheet.currentRevision,
      path: input.path,
      severity: input.severity,
      text: input.text,
      userId: org.actor.userId,
    });
    await tx.audit({
      action: 'finding.raised',
      targetType: 'finding',
      targetId: id,
      details: {
        worksheetId,
        revision: worksheet.currentRevision,
        path: input.path,
        severity: input.severity,
      },
    });
    const finding = (await readFinding(tx, id))!;
    await enqueueMail(
      tx,
      await findingMails(
        tx,
        { kind: 'raised' },
        {
          finding: { ...finding, raisedById: org.actor.userId },
          worksheet,
          actorId: org.actor.userId,
          appUrl,
        },
      ),
    );
    return finding;
  });
}

type FindingStep = 'answer' | 'close' | 'reopen';
const past = { answer: 'answered', close: 'closed', reopen: 'reopened' } as const;

const steps: Record<
  FindingStep,
  { from: Finding['status'][]; to: Finding['status']; ability: 'answer' | 'close'; who: string }
> = {
  answer: { from: ['open'], to: 'answered', ability: 'answer', who: 'the author of the worksheet' },
  close: {
    from: ['open', 'answered'],
    to: 'closed',
    ability: 'close',
    who: 'a checker other than the author',
  },
  reopen: {
    from: ['answered', 'closed'],
    to: 'open',
    ability: 'close',
    who: 'a checker other than the author',
  },
};

/**
 * answer (author: open → answered; the checker who raised it is told), close (checker:
 * open|answered → closed), reopen (checker: → open).
 */
export async function moveFinding(
  org: OrgContext,
  appUrl: string,
  findingId: string,
  step: FindingStep,
  text: string,
): Promise<Finding> {
  return org.write(async (tx) => {
    const finding = await lockFinding(tx, findingId);
    if (!finding) throw noSuchFinding();
    const worksheet = await lockWorksheet(tx, finding.worksheet_id);
    const rule = steps[step];
    if (
      !org.ability.can(
        rule.ability,
        subject('Finding', { worksheetAuthorId: worksheet.authorUserId }),
      )
    ) {
      throw new AppError('forbidden', `Only ${rule.who} may ${step} this finding.`);
    }
    if (!rule.from.includes(finding.status)) {
      throw new AppError(
        'conflict',
        `This finding is ${finding.status}; it cannot be ${past[step]}.`,
      );
    }
    await setFindingStatus(tx, findingId, rule.to, { kind: step, text, userId: org.actor.userId });
    await tx.audit({
      action: `finding.${past[step]}`,
      targetType: 'finding',
      targetId: findingId,
      details: {
        worksheetId: finding.worksheet_id,
        revision: finding.revision_letter,
        path: finding.path,
        severity: finding.severity,
        from: finding.status,
        to: rule.to,
      },
    });
    if (step === 'answer') {
      await enqueueMail(
        tx,
        await findingMails(
          tx,
          { kind: 'answered', text },
          {
            finding: mailFinding(finding),
            worksheet,
            actorId: org.actor.userId,
            appUrl,
          },
        ),
      );
    }
    return (await readFinding(tx, findingId))!;
  });
}
