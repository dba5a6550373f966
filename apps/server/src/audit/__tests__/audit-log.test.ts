import { afterAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../../test-support/test-app.ts';
import {
  createOrgWithMembers,
  signIn,
  systemRows,
  type OrgFixture,
} from '../../test-support/fixtures.ts';
import { inTransaction } from '../../db/transactions.ts';

/** An organization with some history: two role changes and an invitation, by its admin. */
async function orgWithHistory(
  t: TestApp,
): Promise<OrgFixture & { manager: Awaited<ReturnType<typeof signIn>> }> {
  const fx = await createOrgWithMembers(t, { admin: ['admin'], mia: ['manager'], ned: ['author'] });
  const admin = await signIn(t, fx.people.admin!);
  for (const roles of [['author', 'checker'], ['checker']]) {
    await admin.agent
      .patch(`/api/orgs/${fx.org.id}/members/${fx.people.ned!.id}`)
      .set('x-csrf-token', admin.csrf)
      .send({ roles })
      .expect(200);
  }
  await admin.agent
    .post(`/api/orgs/${fx.org.id}/invitations`)
    .set('x-csrf-token', admin.csrf)
    .send({ email: `olga.${Date.now()}@fixture.example`, roles: ['approver'] })
    .expect(201);
  return { ...fx, manager: await signIn(t, fx.people.mia!) };
}

/** Runs SQL with the append-only trigger off, as only the table's owner can; turns it back on. */
async function tamper(t: TestApp, sql: string, bind: unknown[]): Promise<void> {
  await inTransaction(t.sequelize, 'system', async (tx) => {
    await tx.sequelize.query(
      'ALTER TABLE audit_events DISABLE TRIGGER audit_events_no_update_or_delete',
      { transaction: tx.transaction },
    );
    await tx.sequelize.query(sql, { bind, transaction: tx.transaction });
    await tx.sequelize.query(
      'ALTER TABLE audit_events ENABLE TRIGGER audit_events_no_update_or_delete',
      { transaction: tx.transaction },
    );
  });
}

describe('audit log', () => {
  const t = createTestApp();
  afterAll(() => t.close());

  it('when a manager lists the log, then events come newest first with actor names, and account events of members are included', async () => {
    const fx = await orgWithHistory(t);

    const res = await fx.manager.agent.get(`/api/orgs/${fx.org.id}/audit`);

    expect(res.status).toBe(200);
    const items = res.body.items as { action: string }[];
    const actions = items.map((e) => e.action);
    expect(actions.slice(0, 4)).toEqual([
      'auth.signed-in',
      'invitation.created',
      'member.roles-changed',
      'member.roles-changed',
    ]);
    expect(actions).toEqual(
      expect.arrayContaining(['organization.created', 'member.added', 'account.created']),
    );
    expect(res.body.total).toBe(res.body.items.length);
    const change = items.find((e) => e.action === 'member.roles-changed');
    expect(change).toEqual({
      id: expect.any(String),
      at: expect.any(String),
      actor: { id: fx.people.admin!.id, name: fx.people.admin!.name },
      action: 'member.roles-changed',
      targetType: 'user',
      targetId: fx.people.ned!.id,
      revision: null,
      summary: 'Changed the roles of Ned Fixture from author, checker to checker',
      projectId: null,
      worksheetId: null,
      ip: expect.stringMatching(/127\.0\.0\.1$/),
      userAgent: null,
      details: { rolesBefore: ['author', 'checker'], roles: ['checker'] },
    });
  });

  it('when filtered by action, actor, time and page, then only matching events come back with the full total', async () => {
    const fx = await orgWithHistory(t);
    const base = `/api/orgs/${fx.org.id}/audit`;

    const byAction = await fx.manager.agent.get(`${base}?action=member.roles-changed`);
    const byActor = await fx.manager.agent.get(
      `${base}?actor=${fx.people.admin!.id}&action=invitation.created`,
    );
    const page = await fx.manager.agent.get(`${base}?action=member.roles-changed&limit=1&offset=1`);
    const future = await fx.manager.agent.get(`${base}?from=2999-01-01`);
    const past = await fx.manager.agent.get(`${base}?to=2000-01-01`);

    expect(byAction.body.total).toBe(2);
    expect(
      (byAction.body.items as { action: string }[]).every(
        (e) => e.action === 'member.roles-changed',
      ),
    ).toBe(true);
    expect(byActor.body.total).toBe(1);
    expect(page.body.items).toHaveLength(1);
    expect(page.body.total).toBe(2);
    expect(page.body.items[0].details.roles).toEqual(['author', 'checker']);
    expect(future.body).toEqual({ items: [], total: 0 });
    expect(past.body).toEqual({ items: [], total: 0 });
  });

  it('when the chain is untouched, then verify answers ok with the number of events', async () => {
    const fx = await orgWithHistory(t);
    const [{ n } = { n: '0' }] = await systemRows<{ n: string }>(
      t,
      'SELECT count(*) AS n FROM audit_events WHERE org_id = $1',
      [fx.org.id],
    );

    const res = await fx.manager.agent.get(`/api/orgs/${fx.org.id}/audit/verify`);

    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true, events: Number(n) });
    expect(Number(n)).toBe(7); // created, 3 members added, 2 role changes, 1 invitation
  });

  it('when someone edits or deletes an event directly, then the trigger refuses it', async () => {
    const fx = await orgWithHistory(t);
    await expect(
      inTransaction(t.sequelize, 'system', (tx) =>
        tx.sequelize.query(`UPDATE audit_events SET details = '{}' WHERE org_id = $1`, {
          bind: [fx.org.id],
          transaction: tx.transaction,
        }),
      ),
    ).rejects.toThrow(/append-only/);
    await expect(
      inTransaction(t.sequelize, 'system', (tx) =>
        tx.sequelize.query('DELETE FROM audit_events WHERE org_id = $1', {
          bind: [fx.org.id],
          transaction: tx.transaction,
        }),
      ),
    ).rejects.toThrow(/append-only/);
    expect((await fx.manager.agent.get(`/api/orgs/${fx.org.id}/audit/verify`)).body.ok).toBe(true);
  });

  it('when an event is edited with the trigger disabled, then verify answers ok false naming that event', async () => {
    const fx = await orgWithHistory(t);
    const [victim] = await systemRows<{ id: string }>(
      t,
      `SELECT id FROM audit_events WHERE org_id = $1 AND action = 'member.roles-changed' ORDER BY seq LIMIT 1`,
      [fx.org.id],
    );
    await tamper(
      t,
      `UPDATE audit_events SET details = '{"rolesBefore":["author"],"roles":["admin"]}' WHERE id = $1`,
      [victim!.id],
    );

    const res = await fx.manager.agent.get(`/api/orgs/${fx.org.id}/audit/verify`);

    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: false, events: 7, firstBadEventId: victim!.id });
  });

  it('when the newest event is deleted with the trigger disabled, then verify notices the missing tail', async () => {
    const fx = await orgWithHistory(t);
    const [last] = await systemRows<{ id: string }>(
      t,
      'SELECT id FROM audit_events WHERE org_id = $1 ORDER BY seq DESC LIMIT 1',
      [fx.org.id],
    );
    await tamper(t, 'DELETE FROM audit_events WHERE id = $1', [last!.id]);

    const res = await fx.manager.agent.get(`/api/orgs/${fx.org.id}/audit/verify`);

    expect(res.body).toEqual({ ok: false, events: 6, firstBadEventId: last!.id });
  });

  it('when many changes race in one organization, then the chain stays gapless and verifies', async () => {
    const fx = await createOrgWithMembers(t, {
      admin: ['admin'],
      mia: ['manager'],
      a: ['author'],
      b: ['author'],
      c: ['author'],
    });
    const admin = await signIn(t, fx.people.admin!);
    const targets = [fx.people.a!, fx.people.b!, fx.people.c!];
    await Promise.all(
      targets.flatMap((p) =>
        [['checker'], ['author'], ['approver']].map((roles) =>
          admin.agent
            .patch(`/api/orgs/${fx.org.id}/members/${p.id}`)
            .set('x-csrf-token', admin.csrf)
            .send({ roles }),
        ),
      ),
    );
    const seqs = await systemRows<{ seq: string }>(
      t,
      'SELECT seq FROM audit_events WHERE org_id = $1 ORDER BY seq',
      [fx.org.id],
    );
    expect(seqs.map((s) => Number(s.seq))).toEqual(seqs.map((_s, i) => i + 1));
    const manager = await signIn(t, fx.people.mia!);
    expect((await manager.agent.get(`/api/orgs/${fx.org.id}/audit/verify`)).body).toEqual({
      ok: true,
      events: seqs.length,
    });
  });
});
