import type { Finding } from '@biasproof/shared';
import type { OrgTx } from '../orgs/org-scope.ts';
import type { OutboxEntry } from '../outbox/outbox.ts';
import { composeMail } from '../mail/compose.ts';
import type { LockedFinding } from './repository.ts';

/** What happened in a finding's thread: raised by a checker, answered by the author, or a reply. */
export type FindingEvent =
  { kind: 'raised' } | { kind: 'answered'; text: string } | { kind: 'replied'; text: string };

export interface FindingMailInput {
  finding: Pick<Finding, 'id' | 'revision' | 'path' | 'severity' | 'text'> & {
    /** The checker who raised it. */
    raisedById: string;
  };
  worksheet: { id: string; title: string; authorUserId: string };
  actorId: string;
  appUrl: string;
}

/** The mail's view of a stored finding row. */
export const mailFinding = (f: LockedFinding): FindingMailInput['finding'] => ({
  id: f.id,
  revision: f.revision_letter,
  path: f.path,
  severity: f.severity,
  text: f.text,
  raisedById: f.created_by_user_id,
});

/**
 * Whom each event concerns: a raised finding → the worksheet's author; an answer → the
 * checker who raised it; a reply → the other party (author and raiser, less whoever wrote it).
 */
function recipientIds(event: FindingEvent, s: FindingMailInput): string[] {
  const ids =
    event.kind === 'raised'
      ? [s.worksheet.authorUserId]
      : event.kind === 'answered'
        ? [s.finding.raisedById]
        : [s.worksheet.authorUserId, s.finding.raisedById];
  return [...new Set(ids)].filter((id) => id !== s.actorId);
}

function wording(event: FindingEvent, s: FindingMailInput, actor: string, title: string) {
  const f = s.finding;
  const where = `${f.path} of ${title}`;
  switch (event.kind) {
    case 'raised':
      return {
        subject: `Finding (${f.severity}) on ${title}: ${f.path}`,
        paragraphs: [
          `${actor} raised a ${f.severity} finding on ${where}:`,
          f.text,
          ...(f.severity === 'major'
            ? ['Accepting and signing off wait until every major finding is closed.']
            : []),
        ],
      };
    case 'answered':
      return {
        subject: `Answered: your finding on ${title}: ${f.path}`,
        paragraphs: [
          `${actor} answered your finding on ${where}.`,
          `Your finding: ${f.text}`,
          `The answer: ${event.text}`,
          'Close it if the answer settles it, or reopen it.',
        ],
      };
    case 'replied':
      return {
        subject: `Reply on the finding on ${title}: ${f.path}`,
        paragraphs: [
          `${actor} replied on the finding on ${where}.`,
          `The finding: ${f.text}`,
          `The reply: ${event.text}`,
        ],
      };
  }
}

/** The e-mails one event in a finding's thread triggers, for the outbox of the same transaction. */
export async function findingMails(
  tx: OrgTx,
  event: FindingEvent,
  s: FindingMailInput,
): Promise<OutboxEntry[]> {
  const find = (id: string) => tx.models.User.findByPk(id, { transaction: tx.transaction });
  const org = await tx.models.Organization.findByPk(tx.orgId, { transaction: tx.transaction });
  const link = `${s.appUrl.replace(/\/$/, '')}/o/${org?.slug ?? ''}/worksheets/${s.worksheet.id}`;
  const actor = (await find(s.actorId))?.name ?? 'Someone';
  const title = `"${s.worksheet.title}" revision ${s.finding.revision}`;
  const { subject, paragraphs } = wording(event, s, actor, title);
  const mails: OutboxEntry[] = [];
  for (const id of recipientIds(event, s)) {
    const person = await find(id);
    if (!person || person.disabled) continue;
    mails.push({
      kind: `finding.${event.kind}`,
      to: person.email,
      subject,
      link,
      ...composeMail({
        greeting: `Hello ${person.name},`,
        paragraphs,
        link: { url: link, label: 'Open the worksheet' },
        footer: `Sent by Biasproof for ${org?.name ?? 'your organization'}.`,
      }),
    });
  }
  return mails;
}
