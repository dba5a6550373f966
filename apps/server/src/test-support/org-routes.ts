// Every org-scoped route, with the rule (action + subject) that decides who may call it. The
// role × action matrix and the tenant-isolation tests are generated from this list, so a new
// route under /api/orgs/:orgId is added here once and both suites cover it.
import { randomUUID } from 'node:crypto';
import type { Action, SubjectName } from '@biasproof/shared';
import type { Role } from '@biasproof/shared';
import { inTransaction } from '../db/transactions.ts';
import { newLinkToken } from '../auth/tokens.ts';
import { createOrgWithMembers, systemRows, uniqueEmail, type OrgFixture } from './fixtures.ts';
import type { TestApp } from './test-app.ts';

/** An organization to act in: the actor (roles under test), an admin who stays, a member to act on, a pending invitation. */
export interface OrgWorld extends OrgFixture {
  actorId: string;
  targetUserId: string;
  invitationId: string;
}

export async function createOrgWorld(t: TestApp, actorRoles: Role[]): Promise<OrgWorld> {
  const fx = await createOrgWithMembers(t, {
    actor: actorRoles,
    keeper: ['admin'],
    target: ['author'],
  });
  const invitationId = await createPendingInvitation(
    t,
    fx.org.id,
    fx.people.keeper!.id,
    uniqueEmail('invitee'),
  );
  return { ...fx, actorId: fx.people.actor!.id, targetUserId: fx.people.target!.id, invitationId };
}

export async function createPendingInvitation(
  t: TestApp,
  orgId: string,
  invitedByUserId: string,
  email: string,
): Promise<string> {
  return inTransaction(t.sequelize, { orgId }, async (tx) => {
    const row = await tx.models.Invitation.create(
      {
        orgId,
        email,
        roles: ['checker'],
        tokenHash: newLinkToken().tokenHash,
        invitedByUserId,
        expiresAt: new Date(Date.now() + 86_400_000),
      },
      { transaction: tx.transaction },
    );
    return row.id;
  });
}

export interface OrgRouteCase {
  /** e.g. `PATCH /members/:userId` */
  name: string;
  method: 'get' | 'post' | 'patch' | 'delete';
  action: Action;
  subject: SubjectName;
  /** Fields of the object the rule is checked against, when the rule has conditions. */
  objectFields?: (w: OrgWorld) => Record<string, unknown>;
  /** The path after `/api/orgs/:orgId`, with the ids of `ids` (usually the same world). */
  path: (ids: OrgWorld) => string;
  body?: () => object;
  /** The 2xx status of an allowed call. */
  success: number;
  /** True when the path names an object inside the organization (then ids from another organization must 404 too). */
  namesObject: boolean;
}

export const orgRoutes: OrgRouteCase[] = [
  {
    name: 'GET /',
    method: 'get',
    action: 'read',
    subject: 'Organization',
    path: () => '',
    success: 200,
    namesObject: false,
  },
  {
    name: 'GET /members',
    method: 'get',
    action: 'read',
    subject: 'Member',
    path: () => '/members',
    success: 200,
    namesObject: false,
  },
  {
    name: 'PATCH /members/:userId',
    method: 'patch',
    action: 'update',
    subject: 'Member',
    objectFields: (w) => ({ userId: w.targetUserId, roles: ['author'] }),
    path: (w) => `/members/${w.targetUserId}`,
    body: () => ({ roles: ['checker'] }),
    success: 200,
    namesObject: true,
  },
  {
    name: 'DELETE /members/:userId',
    method: 'delete',
    action: 'delete',
    subject: 'Member',
    objectFields: (w) => ({ userId: w.targetUserId, roles: ['author'] }),
    path: (w) => `/members/${w.targetUserId}`,
    success: 204,
    namesObject: true,
  },
  {
    name: 'GET /invitations',
    method: 'get',
    action: 'read',
    subject: 'Invitation',
    path: () => '/invitations',
    success: 200,
    namesObject: false,
  },
  {
    name: 'POST /invitations',
    method: 'post',
    action: 'create',
    subject: 'Invitation',
    path: () => '/invitations',
    body: () => ({ email: uniqueEmail('matrix'), roles: ['author'] }),
    success: 201,
    namesObject: false,
  },
  {
    name: 'POST /invitations/:id/resend',
    method: 'post',
    action: 'update',
    subject: 'Invitation',
    path: (w) => `/invitations/${w.invitationId}/resend`,
    success: 200,
    namesObject: true,
  },
  {
    name: 'DELETE /invitations/:id',
    method: 'delete',
    action: 'delete',
    subject: 'Invitation',
    path: (w) => `/invitations/${w.invitationId}`,
    success: 204,
    namesObject: true,
  },
  {
    name: 'GET /audit',
    method: 'get',
    action: 'read',
    subject: 'AuditLog',
    path: () => '/audit',
    success: 200,
    namesObject: false,
  },
  {
    name: 'GET /audit/verify',
    method: 'get',
    action: 'export',
    subject: 'AuditLog',
    path: () => '/audit/verify',
    success: 200,
    namesObject: false,
  },
];

/** Everything an org-scoped route could change, to compare before and after a refused call. */
export async function orgSnapshot(t: TestApp, orgId: string) {
  return {
    org: await systemRows(
      t,
      'SELECT id, slug, name, timezone, settings, updated_at FROM organizations WHERE id = $1',
      [orgId],
    ),
    memberships: await systemRows(
      t,
      'SELECT user_id, roles, disabled, updated_at FROM memberships WHERE org_id = $1 ORDER BY user_id',
      [orgId],
    ),
    invitations: await systemRows(
      t,
      'SELECT id, email, roles, token_hash, expires_at, accepted_at, revoked_at, updated_at FROM invitations WHERE org_id = $1 ORDER BY id',
      [orgId],
    ),
    users: await systemRows(
      t,
      'SELECT u.id, u.name, u.password_hash, u.disabled FROM users u JOIN memberships m ON m.user_id = u.id WHERE m.org_id = $1 ORDER BY u.id',
      [orgId],
    ),
    auditHead: await systemRows(
      t,
      'SELECT last_seq, last_hash FROM audit_chain_heads WHERE chain = $1',
      [orgId],
    ),
  };
}

/** A well-formed id that names nothing. */
export const absentId = () => randomUUID();
