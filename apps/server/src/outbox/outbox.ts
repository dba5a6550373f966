import { QueryTypes } from 'sequelize';
import type { Tx } from '../db/transactions.ts';
import type { OutgoingMail } from '../mail/send-mail.ts';
import type { OrgTx } from '../orgs/org-scope.ts';

/**
 * A message to send once the writing transaction commits. `kind` names why (e.g.
 * `worksheet.submitted`); kinds `worksheet.*` and `finding.*` are workflow messages, which a
 * recipient may take as a daily digest instead. `link` is the one link it is about (listed in
 * the digest).
 */
export interface OutboxEntry extends Omit<OutgoingMail, 'stableKey'> {
  kind: string;
  link?: string;
}

/** SQL: the message in `column` is a workflow message, held for recipients who chose the digest. */
export const isWorkflowKind = (column: string) =>
  `(${column} LIKE 'worksheet.%' OR ${column} LIKE 'finding.%')`;

async function insertMessages(
  tx: Tx,
  orgId: string | null,
  entries: readonly OutboxEntry[],
): Promise<string[]> {
  const ids: string[] = [];
  for (const m of entries) {
    const [row] = await tx.sequelize.query<{ id: string }>(
      `INSERT INTO outbox_messages (org_id, kind, to_address, subject, text_body, html_body, link)
       VALUES ($1, $2, $3, $4, $5, $6, $7) RETURNING id`,
      {
        bind: [orgId, m.kind, m.to, m.subject, m.text, m.html ?? null, m.link ?? null],
        transaction: tx.transaction,
        type: QueryTypes.SELECT,
      },
    );
    if (row) ids.push(row.id);
  }
  return ids;
}

/**
 * Writes an organization's messages to the outbox inside the caller's transaction: they exist
 * exactly when the change does. Returns the rows' ids.
 */
export async function enqueueMail(tx: OrgTx, entries: readonly OutboxEntry[]): Promise<string[]> {
  return insertMessages(tx, tx.orgId, entries);
}

/**
 * The same for a person's own account (password reset), which belongs to no organization: the
 * row has no org_id and only the system scope can write or read it (migration 20261202-02).
 * Kinds start with `account.`.
 */
export async function enqueueAccountMail(
  tx: Tx,
  entries: readonly (OutboxEntry & { kind: `account.${string}` })[],
): Promise<string[]> {
  return insertMessages(tx, null, entries);
}
