import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestApp } from '../../test-support/test-app.ts';
import { signIn, systemRows, TEST_PASSWORD } from '../../test-support/fixtures.ts';
import { createTeam, newProject, newWorksheet, type Team } from '../../test-support/team.ts';
import { dividerDraft } from '../../worksheets/__tests__/worksheet-drafts.ts';
import { inTransaction } from '../../db/transactions.ts';

interface Row {
  action: string;
  summary: string;
  projectId: string | null;
  worksheetId: string | null;
  revision: string | null;
  ip: string | null;
  userAgent: string | null;
}

describe('audit events with their context', () => {
  const t = createTestApp();
  let team: Team;
  let preamp: { id: string; title: string };
  let supply: { id: string; title: string };
  let projectA: string;
  let projectB: string;
  beforeAll(async () => {
    team = await createTeam(t);
    projectA = (await newProject(team.as.ann, { name: 'Audio front end' })).id;
    projectB = (await newProject(team.as.ann, { name: 'Bench supply' })).id;
    preamp = await newWorksheet(team.as.ann, projectA, { ...dividerDraft(), title: 'Mic preamp' });
    supply = await newWorksheet(team.as.ann, projectB, { ...dividerDraft(), title: 'LDO' });
    await team.as.ann.patch(`/worksheets/${preamp.id}`, {
      version: 1,
      checkerId: team.people.kim!.id,
      approverId: team.people.abe!.id,
    });
    const submitted = await team.as.ann.agent
      .post(team.as.ann.url(`/worksheets/${preamp.id}/transitions`))
      .set('x-csrf-token', team.as.ann.csrf)
      .set('user-agent', 'Bench browser 1.0')
      .send({ action: 'submit', version: 2 });
    expect(submitted.status, JSON.stringify(submitted.body)).toBe(200);
    await team.as.kim.post(`/worksheets/${preamp.id}/findings`, {
      path: 'nodes.out',
      severity: 'minor',
      text: 'Say why 2.5 V.',
    });
  });
  afterAll(() => t.close());

  const list = async (query: string) => {
    const res = await team.as.max.get(`/audit?${query}`);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    return res.body as { items: Row[]; total: number };
  };

  it('when a worksheet is submitted, then its event reads as a sentence and names the worksheet, its project, the revision and the client', async () => {
    const { items } = await list('action=worksheet.submitted');

    expect(items).toHaveLength(1);
    expect(items[0]).toMatchObject({
      summary: 'Submitted "Mic preamp" revision A for check',
      projectId: projectA,
      worksheetId: preamp.id,
      revision: 'A',
      ip: expect.stringMatching(/127\.0\.0\.1$/),
      userAgent: 'Bench browser 1.0',
    });
  });

  it('when filtered by project or worksheet, then only their events come back, findings included', async () => {
    const byProject = await list(`project=${projectA}`);
    const byWorksheet = await list(`worksheet=${supply.id}`);
    const paged = await list(`project=${projectA}&limit=2&offset=1`);

    expect(byProject.items.every((e) => e.projectId === projectA)).toBe(true);
    expect(byProject.items.map((e) => e.action)).toEqual([
      'finding.raised',
      'worksheet.submitted',
      'worksheet.assigned',
      'worksheet.created',
      'project.created',
    ]);
    expect(byProject.items[0]!.summary).toBe(
      'Raised the minor finding on nodes.out of "Mic preamp" revision A',
    );
    expect(byWorksheet.items.map((e) => [e.action, e.summary])).toEqual([
      ['worksheet.created', 'Created "LDO" revision A'],
    ]);
    expect(paged.total).toBe(5);
    expect(paged.items.map((e) => e.action)).toEqual(['worksheet.submitted', 'worksheet.assigned']);
  });

  it('when a filter id is malformed, then it answers 400 naming the field', async () => {
    const res = await team.as.max.get('/audit?worksheet=not-an-id');

    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ worksheet: 'Choose a worksheet from the list.' });
  });

  it('when the server sits behind one trusted proxy, then the address it forwards is recorded, and without trust it is ignored', async () => {
    const proxied = createTestApp({ env: { TRUST_PROXY: 'true' } });
    try {
      for (const [app, expected] of [
        [proxied.app, '203.0.113.7'],
        [t.app, expect.stringMatching(/127\.0\.0\.1$/)],
      ] as const) {
        const agent = request.agent(app);
        const csrf = (await agent.get('/api/auth/csrf')).body.token as string;
        await agent
          .post('/api/auth/sign-in')
          .set('x-csrf-token', csrf)
          .set('x-forwarded-for', '203.0.113.7')
          .set('user-agent', 'Proxy test')
          .send({ email: team.people.bob!.email, password: TEST_PASSWORD })
          .expect(200);
        const [event] = await systemRows<{ ip: string; user_agent: string }>(
          t,
          `SELECT ip, user_agent FROM audit_events
            WHERE org_id IS NULL AND action = 'auth.signed-in' AND actor_user_id = $1
            ORDER BY seq DESC LIMIT 1`,
          [team.people.bob!.id],
        );
        expect(event).toEqual({ ip: expected, user_agent: 'Proxy test' });
      }
    } finally {
      await proxied.close();
    }
  });

  it('when the chain carries the new fields, then it verifies, and a field changed by direct SQL with the trigger disabled is detected', async () => {
    const manager = await signIn(t, team.people.max!);
    const verify = () => manager.agent.get(`/api/orgs/${team.org.id}/audit/verify`);
    expect((await verify()).body.ok).toBe(true);
    const [victim] = await systemRows<{ id: string }>(
      t,
      `SELECT id FROM audit_events WHERE org_id = $1 AND action = 'worksheet.submitted'`,
      [team.org.id],
    );

    /** One UPDATE with the append-only trigger off, committed, as only the table's owner can. */
    const tamper = (column: string, value: string | null) =>
      inTransaction(t.sequelize, 'system', async (tx) => {
        const run = (sql: string, bind: unknown[] = []) =>
          tx.sequelize.query(sql, { bind, transaction: tx.transaction });
        await run('ALTER TABLE audit_events DISABLE TRIGGER audit_events_no_update_or_delete');
        await run(`UPDATE audit_events SET ${column} = $2 WHERE id = $1`, [victim!.id, value]);
        await run('ALTER TABLE audit_events ENABLE TRIGGER audit_events_no_update_or_delete');
      });

    for (const [column, value] of [
      ['user_agent', 'Innocent browser'],
      ['ip', '198.51.100.23'],
      ['summary', 'Nothing happened'],
      ['revision', 'B'],
      ['worksheet_id', supply.id],
    ] as const) {
      const [before] = await systemRows<{ v: string | null }>(
        t,
        `SELECT ${column} AS v FROM audit_events WHERE id = $1`,
        [victim!.id],
      );
      await tamper(column, value);
      expect((await verify()).body, column).toMatchObject({
        ok: false,
        firstBadEventId: victim!.id,
      });
      await tamper(column, before!.v);
    }
    expect((await verify()).body.ok).toBe(true);
  });
});
