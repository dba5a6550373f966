import { QueryTypes } from 'sequelize';
import type { OutgoingMail } from '../mail/send-mail.ts';
import type { OrgTx } from '../orgs/org-scope.ts';

/** A message to send once the writing transaction commits; `kind` names why (e.g. `worksheet.submitted`). */
export interface OutboxEntry extends OutgoingMail {
  kind: string;
}

/** Writes messages to the outbox inside the caller's transaction: they exist exactly when the change does. */
export async function enqueueMail(tx: OrgTx, entries: readonly OutboxEntry[]): Promise<void> {
  for (const m of entries) {
    await tx.sequelize.query(
      `INSERT INTO outbox_messages (org_id, kind, to_address, subject, text_body, html_body)
       VALUES ($1, $2, $3, $4, $5, $6)`,
      {
        bind: [tx.orgId, m.kind, m.to, m.subject, m.text, m.html ?? null],
        transaction: tx.transaction,
        type: QueryTypes.INSERT,
      },
    );
  }
}
