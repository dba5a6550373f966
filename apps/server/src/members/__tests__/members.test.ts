import { randomUUID } from 'node:crypto';
import { afterAll, describe, expect, it } from 'vitest';
import { createTestApp } from '../../test-support/test-app.ts';
import { createOrgWithMembers, signIn, systemRows } from '../../test-support/fixtures.ts';
import { createOrgContext } from '../../orgs/org-scope.ts';
import { removeMember, updateMember } from '../members.ts';

const membership = (t: ReturnType<typeof createTestApp>, orgId: string, userId: string) =>
  systemRows<{ roles: string[]; disabled: boolean }>(
    t,
    'SELECT roles, disabled FROM memberships WHERE org_id = $1 AND user_id = $2',
    [orgId, userId],
  );

const orgEvents = (t: ReturnType<typeof createTestApp>, orgId: string, action: string) =>
  systemRows<{ actor_user_id: string; target_id: string; details: unknown }>(
    t,
    'SELECT actor_user_id, target_id, details FROM audit_events WHERE org_id = $1 AND action = $2 ORDER BY seq',
    [orgId, action],
  );

describe('members administration', () => {
  const t = createTestApp();
  afterAll(() => t.close());

  it('when a member lists the members, then each has e-mail, name, roles, disabled and joined date, by name', async () => {
    const { org, people } = await createOrgWithMembers(t, {
      zoe: ['checker'],
      amy: ['admin', 'author'],
    });
    const { agent } = await signIn(t, people.zoe!);

    const res = await agent.get(`/api/orgs/${org.id}/members`);

    expect(res.status).toBe(200);
    expect(res.body).toEqual({
      items: [
        {
          userId: people.amy!.id,
          email: people.amy!.email,
          name: people.amy!.name,
          roles: ['admin', 'author'],
          disabled: false,
          joinedAt: expect.any(String),
        },
        {
          userId: people.zoe!.id,
          email: people.zoe!.email,
          name: people.zoe!.name,
          roles: ['checker'],
          disabled: false,
          joinedAt: expect.any(String),
        },
      ],
      total: 2,
    });
  });

  it('when an admin changes a member’s roles, then the answer and the row show them and the change is audited', async () => {
    const { org, people } = await createOrgWithMembers(t, { admin: ['admin'], ben: ['author'] });
    const { agent, csrf } = await signIn(t, people.admin!);

    const res = await agent
      .patch(`/api/orgs/${org.id}/members/${people.ben!.id}`)
      .set('x-csrf-token', csrf)
      .send({ roles: ['checker', 'author', 'checker'] });

    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      userId: people.ben!.id,
      roles: ['author', 'checker'],
      disabled: false,
    });
    expect(await membership(t, org.id, people.ben!.id)).toEqual([
      { roles: ['author', 'checker'], disabled: false },
    ]);
    expect(await orgEvents(t, org.id, 'member.roles-changed')).toEqual([
      {
        actor_user_id: people.admin!.id,
        target_id: people.ben!.id,
        details: { rolesBefore: ['author'], roles: ['author', 'checker'] },
      },
    ]);
  });

  it('when an admin disables a member, then that person no longer reaches the organization until enabled again', async () => {
    const { org, people } = await createOrgWithMembers(t, { admin: ['admin'], cleo: ['checker'] });
    const admin = await signIn(t, people.admin!);
    const cleo = await signIn(t, people.cleo!);

    const res = await admin.agent
      .patch(`/api/orgs/${org.id}/members/${people.cleo!.id}`)
      .set('x-csrf-token', admin.csrf)
      .send({ disabled: true });

    expect(res.status).toBe(200);
    expect(res.body.disabled).toBe(true);
    expect((await cleo.agent.get(`/api/orgs/${org.id}`)).status).toBe(404);
    expect((await cleo.agent.get('/api/auth/me')).body.memberships).toEqual([]);
    expect((await orgEvents(t, org.id, 'member.disabled')).map((e) => e.target_id)).toEqual([
      people.cleo!.id,
    ]);

    await admin.agent
      .patch(`/api/orgs/${org.id}/members/${people.cleo!.id}`)
      .set('x-csrf-token', admin.csrf)
      .send({ disabled: false })
      .expect(200);
    expect((await cleo.agent.get(`/api/orgs/${org.id}`)).status).toBe(200);
  });

  it('when an admin removes a member, then the membership row is gone and the person gets 404 for the organization', async () => {
    const { org, people } = await createOrgWithMembers(t, { admin: ['admin'], dora: ['author'] });
    const admin = await signIn(t, people.admin!);
    const dora = await signIn(t, people.dora!);

    const res = await admin.agent
      .delete(`/api/orgs/${org.id}/members/${people.dora!.id}`)
      .set('x-csrf-token', admin.csrf);

    expect(res.status).toBe(204);
    expect(await membership(t, org.id, people.dora!.id)).toEqual([]);
    expect((await dora.agent.get(`/api/orgs/${org.id}/members`)).status).toBe(404);
    expect(await orgEvents(t, org.id, 'member.removed')).toEqual([
      {
        actor_user_id: people.admin!.id,
        target_id: people.dora!.id,
        details: { email: people.dora!.email, roles: ['author'] },
      },
    ]);
  });

  it('when an admin tries to change or remove themselves, then it answers 403 and nothing changes', async () => {
    const { org, people } = await createOrgWithMembers(t, { admin: ['admin'], other: ['admin'] });
    const { agent, csrf } = await signIn(t, people.admin!);

    const raise = await agent
      .patch(`/api/orgs/${org.id}/members/${people.admin!.id}`)
      .set('x-csrf-token', csrf)
      .send({ roles: ['admin', 'manager'] });
    const leave = await agent
      .delete(`/api/orgs/${org.id}/members/${people.admin!.id}`)
      .set('x-csrf-token', csrf);

    expect(raise.status).toBe(403);
    expect(leave.status).toBe(403);
    expect(await membership(t, org.id, people.admin!.id)).toEqual([
      { roles: ['admin'], disabled: false },
    ]);
  });

  it('when a non-admin tries to raise their own roles, then it answers 403 and nothing changes', async () => {
    const { org, people } = await createOrgWithMembers(t, { admin: ['admin'], eve: ['author'] });
    const { agent, csrf } = await signIn(t, people.eve!);
    const res = await agent
      .patch(`/api/orgs/${org.id}/members/${people.eve!.id}`)
      .set('x-csrf-token', csrf)
      .send({ roles: ['admin'] });
    expect(res.status).toBe(403);
    expect(await membership(t, org.id, people.eve!.id)).toEqual([
      { roles: ['author'], disabled: false },
    ]);
  });

  it('when a change would leave no active admin, then it answers last-admin and rolls back', async () => {
    // Through the API an admin never edits themselves, so another admin always remains; the
    // guard still protects the use cases against any caller (an operator's tool, a future route).
    const { org, people } = await createOrgWithMembers(t, { solo: ['admin'] });
    const outsider = createOrgContext(t.sequelize, org.id, {
      userId: randomUUID(),
      roles: ['admin'],
    });

    await expect(
      updateMember(outsider, people.solo!.id, { roles: ['author'] }),
    ).rejects.toMatchObject({ code: 'last-admin', status: 409 });
    await expect(updateMember(outsider, people.solo!.id, { disabled: true })).rejects.toMatchObject(
      { code: 'last-admin' },
    );
    await expect(removeMember(outsider, people.solo!.id)).rejects.toMatchObject({
      code: 'last-admin',
    });
    expect(await membership(t, org.id, people.solo!.id)).toEqual([
      { roles: ['admin'], disabled: false },
    ]);
    expect(await orgEvents(t, org.id, 'member.roles-changed')).toEqual([]);
  });
});
