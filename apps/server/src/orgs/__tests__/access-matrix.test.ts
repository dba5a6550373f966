import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { defineAbilityFor, roles, subject, type Role } from '@biasproof/shared';
import { createTestApp } from '../../test-support/test-app.ts';
import { signIn } from '../../test-support/fixtures.ts';
import {
  createOrgWorld,
  orgRoutes,
  orgSnapshot,
  type OrgRouteCase,
  withRouteBody,
  type OrgWorld,
} from '../../test-support/org-routes.ts';

/** What the rules say a person with `role` may do on this route in `world`. */
function allowedByRules(route: OrgRouteCase, role: Role, world: OrgWorld): boolean {
  const ability = defineAbilityFor({ userId: world.actorId, roles: [role] });
  return route.objectFields
    ? ability.can(
        route.action,
        subject(
          route.subject as 'Member',
          route.objectFields(world) as { userId: string; roles: Role[] },
        ),
      )
    : ability.can(route.action, route.subject);
}

const cells = roles.flatMap((role) => orgRoutes.map((route) => ({ role, route })));

describe('role × action matrix, generated from the ability rules', () => {
  const t = createTestApp();
  let foreign: OrgWorld;
  beforeAll(async () => {
    foreign = await createOrgWorld(t, ['admin', 'manager']);
  });
  afterAll(() => t.close());

  it('when the matrix is generated, then it covers every role and route and has allowed and denied cells', () => {
    expect(cells).toHaveLength(roles.length * orgRoutes.length);
    const verdicts = new Set(
      cells.map(({ role, route }) =>
        allowedByRules(route, role, { actorId: 'a', targetUserId: 'b' } as OrgWorld),
      ),
    );
    expect(verdicts).toEqual(new Set([true, false]));
  });

  it.each(cells.map(({ role, route }) => [role, route.name, route] as const))(
    'when a person with role %s calls %s, then the answer follows the rules, and another organization’s copy answers 404',
    async (role, _name, route) => {
      const world = await createOrgWorld(t, [role]);
      const { agent, csrf } = await signIn(t, world.people.actor!);
      const expected = allowedByRules(route, role, world);
      const before = await orgSnapshot(t, world.org.id);
      const call = (orgId: string, ids: OrgWorld) => {
        const req = agent[route.method](`/api/orgs/${orgId}${route.path(ids)}`).set(
          'x-csrf-token',
          csrf,
        );
        return withRouteBody(req, route, ids);
      };

      const own = await call(world.org.id, world);

      if (expected) {
        expect(own.status, JSON.stringify(own.body)).toBe(route.success);
        // An allowed change is a state change: it appended to the organization's audit chain.
        const after = await orgSnapshot(t, world.org.id);
        if (route.method === 'get' && !route.auditedRead) expect(after).toEqual(before);
        else expect(after.auditHead).not.toEqual(before.auditHead);
      } else {
        expect(own.status, JSON.stringify(own.body)).toBe(403);
        expect(own.body.error.code).toBe('forbidden');
        expect(await orgSnapshot(t, world.org.id)).toEqual(before);
      }

      const foreignBefore = await orgSnapshot(t, foreign.org.id);
      const other = await call(foreign.org.id, foreign);
      expect(other.status).toBe(404);
      expect(other.body.error.code).toBe('not-found');
      expect(await orgSnapshot(t, foreign.org.id)).toEqual(foreignBefore);
    },
  );
});
