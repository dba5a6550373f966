// The review tests' view of e-mail: the outbox rows a worksheet caused, a dispatcher pass that
// sends them, and maildev's copies read back.
import { expect } from 'vitest';
import type { TestApp } from '../../test-support/test-app.ts';
import { systemRows } from '../../test-support/fixtures.ts';
import { listEmails, waitForEmailWhere } from '../../test-support/maildev.ts';
import { dispatchOutbox } from '../../outbox/dispatcher.ts';

export interface MailRow {
  id: string;
  kind: string;
  to_address: string;
  subject: string;
  text_body: string;
  html_body: string | null;
  link: string | null;
  sent_at: Date | null;
}

/** The organization's outbox rows about one worksheet (their text carries its link). */
export async function outboxOf(t: TestApp, orgId: string, worksheetId: string) {
  const rows = await systemRows<MailRow>(
    t,
    `SELECT id, kind, to_address, subject, text_body, html_body, link, sent_at
       FROM outbox_messages WHERE org_id = $1 ORDER BY created_at, id`,
    [orgId],
  );
  return rows.filter((r) => r.text_body.includes(`/worksheets/${worksheetId}`));
}

/** Runs the dispatcher over one organization's messages until none is left to send. */
export async function drainOutbox(t: TestApp, orgId: string): Promise<void> {
  for (;;) {
    const { sent, failed } = await dispatchOutbox(t.sequelize, t.mailer, { orgId, batch: 50 });
    expect(failed).toBe(0);
    if (sent === 0) return;
  }
}

const sameText = (a: string | undefined, b: string) =>
  (a ?? '').replace(/\s+/g, ' ').trim() === b.replace(/\s+/g, ' ').trim();

/**
 * Each row arrived in maildev exactly once, to its recipient, with its subject and text, and the
 * worksheet link in both the text and the HTML part.
 */
export async function expectDelivered(rows: readonly MailRow[], link: string): Promise<void> {
  const matches = (r: MailRow) => (m: Awaited<ReturnType<typeof listEmails>>[number]) =>
    m.to.some((to) => to.address.toLowerCase() === r.to_address.toLowerCase()) &&
    m.subject === r.subject &&
    sameText(m.text, r.text_body);
  for (const r of rows) {
    const mail = await waitForEmailWhere(r.to_address, matches(r));
    expect(mail.text).toContain(link);
    expect(mail.html).toContain(`href="${link}"`);
  }
  const all = await listEmails();
  for (const r of rows) expect(all.filter(matches(r)), r.subject).toHaveLength(1);
}
