import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import request from 'supertest';
import { createTestApp } from '../../test-support/test-app.ts';
import { signIn, type SignedInAgent } from '../../test-support/fixtures.ts';
import {
  absentId,
  createOrgWorld,
  malformedIds,
  orgRoutes,
  orgSnapshot,
  type OrgRouteCase,
  withRouteBody,
  type OrgWorld,
} from '../../test-support/org-routes.ts';
import { inTransaction } from '../../db/transactions.ts';
import { createOrgContext } from '../org-scope.ts';

describe('tenant isolation', () => {
  const t = createTestApp();
  let home: OrgWorld;
  let away: OrgWorld;
  let actor: SignedInAgent;
  beforeAll(async () => {
    // The actor holds every role at home, so only the organization boundary can refuse them.
    home = await createOrgWorld(t, ['admin', 'author', 'checker', 'approver', 'manager']);
    away = await createOrgWorld(t, ['admin', 'manager']);
    actor = await signIn(t, home.people.actor!);
  });
  afterAll(() => t.close());

  const call = (route: OrgRouteCase, orgId: string, ids: OrgWorld) => {
    const req = actor.agent[route.method](`/api/orgs/${orgId}${route.path(ids)}`).set(
      'x-csrf-token',
      actor.csrf,
    );
    return withRouteBody(req, route, ids);
  };

  async function expectUnchanged(
    act: () => Promise<{ status: number; body: { error?: { code: string } } }>,
  ) {
    const before = [await orgSnapshot(t, home.org.id), await orgSnapshot(t, away.org.id)];
    const res = await act();
    expect(res.status).toBe(404);
    expect(res.body.error?.code).toBe('not-found');
    expect([await orgSnapshot(t, home.org.id), await orgSnapshot(t, away.org.id)]).toEqual(before);
  }

  it.each(orgRoutes.map((r) => [r.name, r] as const))(
    'when %s is called with another organization’s id, then it answers 404 and no row of either organization changes',
    async (_name, route) => {
      await expectUnchanged(() => call(route, away.org.id, away));
    },
  );

  it.each(orgRoutes.filter((r) => r.namesObject).map((r) => [r.name, r] as const))(
    'when %s names another organization’s object under one’s own organization, then it answers 404 and nothing changes',
    async (_name, route) => {
      await expectUnchanged(() => call(route, home.org.id, away));
    },
  );

  it.each(orgRoutes.map((r) => [r.name, r] as const))(
    'when %s is called with a malformed or absent organization id, then it answers 404',
    async (_name, route) => {
      await expectUnchanged(() => call(route, 'not-a-uuid', home));
      await expectUnchanged(() => call(route, absentId(), home));
    },
  );

  it.each(orgRoutes.filter((r) => r.namesObject).map((r) => [r.name, r] as const))(
    'when %s names a malformed object id, then it answers 404',
    async (_name, route) => {
      await expectUnchanged(() => call(route, home.org.id, malformedIds(home)));
    },
  );

  it('when signed out, then org-scoped routes answer 401 before anything else', async () => {
    const res = await request(t.app).get(`/api/orgs/${home.org.id}/members`);
    expect(res.status).toBe(401);
  });
});

describe('row-level security, the second wall', () => {
  const t = createTestApp();
  let home: OrgWorld;
  let away: OrgWorld;
  beforeAll(async () => {
    home = await createOrgWorld(t, ['admin']);
    away = await createOrgWorld(t, ['admin']);
  });
  afterAll(() => t.close());

  it('when a query inside one organization’s scope forgets its filter, then it still sees only that organization’s rows', async () => {
    const org = createOrgContext(t.sequelize, home.org.id, {
      userId: home.actorId,
      roles: ['admin'],
    });
    const seen = await org.read(async (tx) => ({
      orgs: await tx.models.Organization.findAll({ transaction: tx.transaction }),
      memberships: await tx.models.Membership.findAll({ transaction: tx.transaction }),
      invitations: await tx.models.Invitation.findAll({ transaction: tx.transaction }),
      awayMembers: await tx.models.Membership.findAll({
        where: { orgId: away.org.id },
        transaction: tx.transaction,
      }),
      chainEvents: await tx.models.AuditEvent.findAll({
        where: { orgId: away.org.id },
        transaction: tx.transaction,
      }),
    }));
    expect(seen.orgs.map((o) => o.id)).toEqual([home.org.id]);
    expect(new Set(seen.memberships.map((m) => m.orgId))).toEqual(new Set([home.org.id]));
    expect(seen.memberships).toHaveLength(5);
    expect(seen.invitations.map((i) => i.orgId)).toEqual([home.org.id]);
    expect(seen.awayMembers).toEqual([]);
    expect(seen.chainEvents).toEqual([]);
  });

  it('when a write inside one organization’s scope targets another organization, then PostgreSQL refuses it', async () => {
    const org = createOrgContext(t.sequelize, home.org.id, {
      userId: home.actorId,
      roles: ['admin'],
    });
    await expect(
      org.write((tx) =>
        tx.models.Membership.create(
          { orgId: away.org.id, userId: home.actorId, roles: ['admin'] },
          { transaction: tx.transaction },
        ),
      ),
    ).rejects.toThrow(/row-level security/);
    const awayBefore = (await orgSnapshot(t, away.org.id)).memberships;
    const [updated] = await org.write((tx) =>
      tx.models.Membership.update(
        { roles: ['checker'] },
        { where: { orgId: away.org.id }, transaction: tx.transaction },
      ),
    );
    expect(updated).toBe(0);
    expect((await orgSnapshot(t, away.org.id)).memberships).toEqual(awayBefore);
  });

  it('when a query runs outside any scoped transaction, then it sees no tenant rows at all (fails closed)', async () => {
    const rows = await t.sequelize.query(
      'SELECT id FROM memberships UNION ALL SELECT id FROM organizations',
      { type: QueryTypes.SELECT },
    );
    expect(rows).toEqual([]);
    const scoped = await inTransaction(t.sequelize, 'system', (tx) =>
      tx.sequelize.query('SELECT id FROM organizations WHERE id = $1', {
        bind: [home.org.id],
        transaction: tx.transaction,
        type: QueryTypes.SELECT,
      }),
    );
    expect(scoped).toHaveLength(1);
  });
});
