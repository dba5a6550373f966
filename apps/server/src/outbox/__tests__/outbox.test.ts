import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { inTransaction } from '../../db/transactions.ts';
import { systemRows, TEST_PASSWORD } from '../../test-support/fixtures.ts';
import { createTeam, newProject, type Team } from '../../test-support/team.ts';
import type { Mailer } from '../../mail/send-mail.ts';
import { dispatchOutbox, retryDelaySeconds } from '../dispatcher.ts';
import {
  createOutboxWorld,
  outboxRows,
  step,
  submittedWorksheet,
  type OutboxRow,
  type OutboxWorld,
} from './outbox-world.ts';

describe('e-mail through the outbox', () => {
  let w: OutboxWorld;
  let team: Team;
  let projectId: string;
  beforeAll(async () => {
    w = await createOutboxWorld();
    team = await createTeam(w.t);
    projectId = (await newProject(team.as.ann)).id;
  });
  afterAll(() => w.close());

  /** The transition messages about one worksheet (finding messages have tests of their own). */
  const rowsOf = async (worksheetId: string) =>
    (await outboxRows(w.t, "org_id = $1 AND kind LIKE 'worksheet.%'", [team.org.id])).filter((r) =>
      r.text_body.includes(worksheetId),
    );
  const smtpDown: Mailer = {
    send: () => Promise.reject(new Error('connect ECONNREFUSED 127.0.0.1:1')),
  };

  it('when transitions run, then each writes its messages for whoever acts next, and the dispatcher sends each exactly once, in text and HTML, with the worksheet link', async () => {
    const ws = await submittedWorksheet(team, projectId, `Mail <1> & "more"`);
    await team.as.kim.post(`/worksheets/${ws.id}/findings`, {
      path: 'nodes.out',
      severity: 'major',
      text: 'Too low.',
    });
    await step(team.as.kim, ws.id, { action: 'return', version: 3 });
    const rows = await rowsOf(ws.id);
    const link = `http://biasproof.test.example/o/${team.org.slug}/worksheets/${ws.id}`;
    expect(rows.map((r) => [r.kind, r.to_address, r.link])).toEqual([
      ['worksheet.submitted', team.people.kim!.email, link],
      ['worksheet.returned', team.people.ann!.email, link],
    ]);
    expect(rows[1]!.text_body).toContain('- [major] nodes.out: Too low.');
    expect(rows[1]!.html_body).toContain('<li>[major] nodes.out: Too low.</li>');

    expect(await dispatchOutbox(w.t.sequelize, w.t.mailer)).toMatchObject({ failed: 0 });
    expect(await dispatchOutbox(w.t.sequelize, w.t.mailer)).toEqual({ sent: 0, failed: 0 });

    const mails = (await w.maildev.list()).filter(
      (m) => (m.text ?? '').includes(link) && !/^finding/i.test(m.subject),
    );
    expect(mails.map((m) => [m.to[0]?.address, m.subject])).toEqual([
      [team.people.kim!.email, `To check: "${ws.title}" revision A`],
      [team.people.ann!.email, `Returned: "${ws.title}" revision A`],
    ]);
    const toKim = mails[0]!;
    expect(toKim.text).toContain(`Hello Kim Fixture,`);
    expect(toKim.text).toContain(`Open the worksheet: ${link}`);
    // The title is escaped in HTML, and the link is an anchor.
    expect(toKim.html).toContain('Mail &lt;1&gt; &amp; &quot;more&quot;');
    expect(toKim.html).toMatch(new RegExp(`<a [^>]*href="${link}"`));
    const sent = await rowsOf(ws.id);
    expect(sent.every((r) => r.sent_at !== null && r.attempts === 1)).toBe(true);
    expect(sent.every((r) => r.claimed_until === null)).toBe(true);
  });

  it('when SMTP is down, then attempts are counted and retried later with backoff, and the message is delivered once when it is back', async () => {
    await dispatchOutbox(w.t.sequelize, w.t.mailer);
    const ws = await submittedWorksheet(team, projectId, `Backoff ${Date.now()}`);
    const [row] = await rowsOf(ws.id);

    const down = await dispatchOutbox(w.t.sequelize, smtpDown);
    expect(down).toEqual({ sent: 0, failed: 1 });
    const [failed] = await outboxRows(w.t, 'id = $1', [row!.id]);
    expect(failed).toMatchObject({
      attempts: 1,
      sent_at: null,
      claimed_until: null,
      last_error: 'connect ECONNREFUSED 127.0.0.1:1',
    });
    expect(new Date(failed!.next_attempt_at).getTime()).toBeGreaterThan(Date.now() + 2000);
    // Not due yet: a pass now leaves it alone.
    expect(await dispatchOutbox(w.t.sequelize, w.t.mailer)).toEqual({ sent: 0, failed: 0 });

    const later = () => new Date(Date.now() + retryDelaySeconds(1) * 1000 + 1000);
    const [a, b] = await Promise.all([
      dispatchOutbox(w.t.sequelize, w.t.mailer, { now: later }),
      dispatchOutbox(w.t.sequelize, w.t.mailer, { now: later }),
    ]);
    expect(a.sent + b.sent).toBe(1);
    const copies = (await w.maildev.list()).filter((m) => (m.text ?? '').includes(ws.id));
    expect(copies).toHaveLength(1);
    const [done] = await outboxRows(w.t, 'id = $1', [row!.id]);
    expect(done).toMatchObject({ attempts: 2, last_error: null });
    expect(done!.sent_at).not.toBeNull();
  });

  it('when a transition is refused, then it writes no message', async () => {
    const ws = await submittedWorksheet(team, projectId, `Refused ${Date.now()}`);
    await step(team.as.kim, ws.id, { action: 'accept', version: 3 });
    const before = (await outboxRows(w.t)).length;
    const res = await team.as.abe.post(`/worksheets/${ws.id}/transitions`, {
      action: 'sign',
      version: 4,
      meaning: 'Reviewed',
      password: `${TEST_PASSWORD}-wrong`,
    });
    expect(res.status).toBe(403);
    expect((await outboxRows(w.t)).length).toBe(before);
  });

  it('when an organization transaction looks at the outbox, then it sees its own messages only, never account messages', async () => {
    await systemRows(
      w.t,
      `INSERT INTO outbox_messages (org_id, kind, to_address, subject, text_body)
       VALUES (NULL, 'account.password-reset', 'ola@fixture.example', 'Reset', 'x') RETURNING id`,
    );
    const seen = await inTransaction(w.t.sequelize, { orgId: team.org.id }, (tx) =>
      tx.sequelize.query<OutboxRow>('SELECT org_id FROM outbox_messages', {
        transaction: tx.transaction,
        type: QueryTypes.SELECT,
      }),
    );
    expect(seen.length).toBeGreaterThan(0);
    expect(seen.every((r) => r.org_id === team.org.id)).toBe(true);
    await expect(
      inTransaction(w.t.sequelize, { orgId: team.org.id }, (tx) =>
        tx.sequelize.query(
          `INSERT INTO outbox_messages (org_id, kind, to_address, subject, text_body)
           VALUES (NULL, 'account.password-reset', 'ola@fixture.example', 'Reset', 'x')`,
          { transaction: tx.transaction },
        ),
      ),
    ).rejects.toThrow(/row-level security/);
  });

  it('when an organization message has no organization, then the database refuses it', async () => {
    await expect(
      systemRows(
        w.t,
        `INSERT INTO outbox_messages (org_id, kind, to_address, subject, text_body)
         VALUES (NULL, 'worksheet.submitted', 'ola@fixture.example', 'To check', 'x') RETURNING id`,
      ),
    ).rejects.toThrow(/outbox_messages_org_or_personal/);
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
