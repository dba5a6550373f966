import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp } from '../../test-support/test-app.ts';
import { systemRows, TEST_PASSWORD } from '../../test-support/fixtures.ts';
import { listEmails, waitForEmailWhere } from '../../test-support/maildev.ts';
import { createTeam, newProject, newWorksheet, type Team } from '../../test-support/team.ts';
import { dividerDraft } from '../../worksheets/__tests__/worksheet-drafts.ts';
import type { Mailer } from '../../mail/send-mail.ts';
import { dispatchOutbox, retryDelaySeconds } from '../dispatcher.ts';

interface OutboxRow {
  id: string;
  kind: string;
  to_address: string;
  subject: string;
  text_body: string;
  attempts: number;
  sent_at: Date | null;
  next_attempt_at: Date;
  last_error: string | null;
}

describe('e-mail through the outbox', () => {
  const t = createTestApp();
  let team: Team;
  let projectId: string;
  beforeAll(async () => {
    team = await createTeam(t);
    projectId = (await newProject(team.as.ann)).id;
  });
  afterAll(() => t.close());

  const outbox = () =>
    systemRows<OutboxRow>(
      t,
      'SELECT * FROM outbox_messages WHERE org_id = $1 ORDER BY created_at, id',
      [team.org.id],
    );
  const smtpDown: Mailer = {
    send: () => Promise.reject(new Error('connect ECONNREFUSED 127.0.0.1:1')),
  };

  async function submitted() {
    const ws = await newWorksheet(team.as.ann, projectId, {
      ...dividerDraft(),
      title: `Mail ${Date.now()}`,
    });
    await team.as.ann.patch(`/worksheets/${ws.id}`, {
      version: 1,
      checkerId: team.people.kim!.id,
      approverId: team.people.abe!.id,
    });
    const res = await team.as.ann.post(`/worksheets/${ws.id}/transitions`, {
      action: 'submit',
      version: 2,
    });
    expect(res.status).toBe(200);
    return ws;
  }

  it('when transitions run, then each writes its messages for whoever acts next, and the dispatcher sends each exactly once with the worksheet link', async () => {
    const ws = await submitted();
    const kim = team.as.kim;
    await kim.post(`/worksheets/${ws.id}/findings`, {
      path: 'nodes.out',
      severity: 'major',
      text: 'Too low.',
    });
    await kim.post(`/worksheets/${ws.id}/transitions`, { action: 'return', version: 3 });
    const rows = (await outbox()).filter((r) => r.text_body.includes(ws.id));
    expect(rows.map((r) => [r.kind, r.to_address])).toEqual([
      ['worksheet.submitted', team.people.kim!.email],
      ['worksheet.returned', team.people.ann!.email],
    ]);
    expect(rows[1]!.text_body).toContain('- [major] nodes.out: Too low.');

    expect(await dispatchOutbox(t.sequelize, t.mailer, { orgId: team.org.id })).toMatchObject({
      failed: 0,
    });
    expect(await dispatchOutbox(t.sequelize, t.mailer, { orgId: team.org.id })).toEqual({
      sent: 0,
      failed: 0,
    });
    const link = `http://biasproof.test.example/o/${team.org.slug}/worksheets/${ws.id}`;
    const mail = await waitForEmailWhere(team.people.kim!.email, (m) =>
      (m.text ?? '').includes(link),
    );
    expect(mail.subject).toBe(`To check: "${ws.title}" revision A`);
    const toAnn = await waitForEmailWhere(team.people.ann!.email, (m) =>
      m.subject.startsWith('Returned:'),
    );
    expect(toAnn.text).toContain(link);
    const sent = (await outbox()).filter((r) => r.text_body.includes(ws.id));
    expect(sent.every((r) => r.sent_at !== null && r.attempts === 1)).toBe(true);
  });

  it('when SMTP is down, then attempts are counted and retried later with backoff, and the message is delivered once when it is back', async () => {
    const ws = await submitted();
    const [row] = (await outbox()).filter((r) => r.text_body.includes(ws.id) && r.sent_at === null);
    expect(row).toBeDefined();

    const down = await dispatchOutbox(t.sequelize, smtpDown, { orgId: team.org.id });
    expect(down.failed).toBeGreaterThanOrEqual(1);
    const [failed] = await systemRows<OutboxRow>(t, 'SELECT * FROM outbox_messages WHERE id = $1', [
      row!.id,
    ]);
    expect(failed).toMatchObject({
      attempts: 1,
      sent_at: null,
      last_error: 'connect ECONNREFUSED 127.0.0.1:1',
    });
    expect(new Date(failed!.next_attempt_at).getTime()).toBeGreaterThan(Date.now() + 2000);
    // Not due yet: a pass now leaves it alone.
    expect(await dispatchOutbox(t.sequelize, t.mailer, { orgId: team.org.id })).toEqual({
      sent: 0,
      failed: 0,
    });

    await systemRows(
      t,
      'UPDATE outbox_messages SET next_attempt_at = now() WHERE id = $1 RETURNING id',
      [row!.id],
    );
    const [a, b] = await Promise.all([
      dispatchOutbox(t.sequelize, t.mailer, { orgId: team.org.id }),
      dispatchOutbox(t.sequelize, t.mailer, { orgId: team.org.id }),
    ]);
    expect(a.sent + b.sent).toBe(1);
    await waitForEmailWhere(team.people.kim!.email, (m) => (m.text ?? '').includes(ws.id));
    const copies = (await listEmails()).filter((m) => (m.text ?? '').includes(ws.id));
    expect(copies).toHaveLength(1);
    const [done] = await systemRows<OutboxRow>(t, 'SELECT * FROM outbox_messages WHERE id = $1', [
      row!.id,
    ]);
    expect(done).toMatchObject({ attempts: 2, last_error: null });
    expect(done!.sent_at).not.toBeNull();
  });

  it('when a transition is refused, then it writes no message', async () => {
    const ws = await submitted();
    await team.as.kim.post(`/worksheets/${ws.id}/transitions`, { action: 'accept', version: 3 });
    const before = (await outbox()).length;
    const res = await team.as.abe.post(`/worksheets/${ws.id}/transitions`, {
      action: 'sign',
      version: 4,
      meaning: 'Reviewed',
      password: `${TEST_PASSWORD}-wrong`,
    });
    expect(res.status).toBe(403);
    expect((await outbox()).length).toBe(before);
  });

  it.each([
    [1, 5],
    [2, 10],
    [3, 20],
    [8, 640],
    [9, 900],
    [40, 900],
  ])('when %i attempts failed, then the next waits %i s', (attempts, seconds) => {
    expect(retryDelaySeconds(attempts)).toBe(seconds);
  });
});
