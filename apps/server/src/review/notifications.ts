import type { WorkflowAction } from '@biasproof/shared';
import type { OrgTx } from '../orgs/org-scope.ts';
import type { WorksheetRow } from '../db/models/worksheet.ts';
import type { OutboxEntry } from '../outbox/outbox.ts';
import { composeMail, type MailParts } from '../mail/compose.ts';
import { listFindings } from './repository.ts';
import { listWatchers } from './watchers.ts';

interface Person {
  email: string;
  name: string;
}

async function person(tx: OrgTx, id: string | null): Promise<Person | null> {
  if (!id) return null;
  const user = await tx.models.User.findByPk(id, { transaction: tx.transaction });
  return user && !user.disabled ? { email: user.email, name: user.name } : null;
}

/**
 * The e-mails a transition triggers, to whoever acts next: submitted → the checker, returned →
 * the author with the open findings, accepted → the approver, signed → the author, the
 * checker and the worksheet's watchers, with a link to the signed revision's report. Written to
 * the outbox in the transition's transaction.
 */
export async function transitionMails(
  tx: OrgTx,
  s: {
    action: WorkflowAction;
    worksheet: WorksheetRow;
    revision: string;
    actorName: string;
    appUrl: string;
  },
): Promise<OutboxEntry[]> {
  const { worksheet: w, revision } = s;
  const org = await tx.models.Organization.findByPk(tx.orgId, { transaction: tx.transaction });
  const link = `${s.appUrl.replace(/\/$/, '')}/o/${org?.slug ?? ''}/worksheets/${w.id}`;
  const title = `"${w.title}" revision ${revision}`;
  const mail = (
    kind: string,
    to: Person | null,
    subject: string,
    paragraphs: MailParts['paragraphs'],
  ): OutboxEntry[] =>
    to
      ? [
          {
            kind,
            to: to.email,
            subject,
            link,
            ...composeMail({
              greeting: `Hello ${to.name},`,
              paragraphs,
              link: { url: link, label: 'Open the worksheet' },
              footer: `Sent by Biasproof for ${org?.name ?? 'your organization'}.`,
            }),
          },
        ]
      : [];
  const author = await person(tx, w.authorUserId);
  switch (s.action) {
    case 'submit':
      return mail('worksheet.submitted', await person(tx, w.checkerUserId), `To check: ${title}`, [
        `${s.actorName} submitted ${title} for your check.`,
      ]);
    case 'return': {
      const open = (await listFindings(tx, w.id)).filter((f) => f.status !== 'closed');
      return mail('worksheet.returned', author, `Returned: ${title}`, [
        `${s.actorName} returned ${title} to you.`,
        ...(open.length
          ? ['Open findings:', open.map((f) => `[${f.severity}] ${f.path}: ${f.text}`)]
          : []),
      ]);
    }
    case 'accept':
      return mail(
        'worksheet.accepted',
        await person(tx, w.approverUserId),
        `To sign off: ${title}`,
        [`${s.actorName} accepted ${title}; it awaits your signature.`],
      );
    case 'sign': {
      const checker = await person(tx, w.checkedByUserId ?? w.checkerUserId);
      const report = {
        label: `Report of revision ${revision} (PDF)`,
        url: `${s.appUrl.replace(/\/$/, '')}/api/orgs/${tx.orgId}/worksheets/${w.id}/revisions/${revision}/report.pdf`,
      };
      const lines = [`${s.actorName} signed off ${title}.`, [report]];
      // Author, checker and watchers, each once (a watcher may also be the author).
      const recipients = new Map<string, Person>();
      for (const p of [author, checker, ...(await listWatchers(tx, w.id))]) {
        if (p && !recipients.has(p.email)) recipients.set(p.email, p);
      }
      return [...recipients.values()].flatMap((to) =>
        mail('worksheet.signed', to, `Signed off: ${title}`, lines),
      );
    }
    case 'withdraw':
    case 'revise':
      return [];
  }
}
