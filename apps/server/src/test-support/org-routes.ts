// Every org-scoped route, with the rule (action + subject) that decides who may call it. The
// role × action matrix and the tenant-isolation tests are generated from this list, so a new
// route under /api/orgs/:orgId is added here once and both suites cover it.
import { randomUUID } from 'node:crypto';
import type { Action, SubjectName } from '@biasproof/shared';
import type { Role } from '@biasproof/shared';
import type { Test } from 'supertest';
import { inTransaction } from '../db/transactions.ts';
import { newLinkToken } from '../auth/tokens.ts';
import {
  createOrgWithMembers,
  fixturePng,
  insertAttachmentRow,
  insertFindingRow,
  insertModelRow,
  insertProjectRow,
  insertWorksheetRow,
  systemRows,
  TEST_PASSWORD,
  unique,
  uniqueEmail,
  type OrgFixture,
} from './fixtures.ts';
import type { TestApp } from './test-app.ts';

/**
 * An organization to act in: the actor (roles under test), an admin who stays, a member to act
 * on, a pending invitation, a project, a draft worksheet authored by the actor, another one
 * authored by the member with a checker assigned, and a library model.
 */
export interface OrgWorld extends OrgFixture {
  actorId: string;
  /** The admin who stays; the checker who accepted the checked worksheet. */
  keeperId: string;
  targetUserId: string;
  invitationId: string;
  projectId: string;
  /**
   * Authored by the actor, with a checker and an approver assigned (so it may be submitted);
   * its results carry an older engine version, so a recompute changes them.
   */
  worksheetId: string;
  /** Authored by the target member; the keeper is assigned as its checker. */
  assignedWorksheetId: string;
  /** Authored by the target member, in check (revision A frozen), the actor its assigned checker. */
  inCheckWorksheetId: string;
  /** Authored by the target member, checked by the keeper, the actor its assigned approver. */
  checkedWorksheetId: string;
  /** An open minor finding on the actor's worksheet (for the author to answer). */
  findingId: string;
  /** An open minor finding on the worksheet in check (for a checker to close). */
  reviewFindingId: string;
  /** A closed finding on the worksheet in check (for a checker to reopen). */
  closedFindingId: string;
  modelId: string;
  /** A PNG the actor attached to their draft worksheet (revision A, not frozen). */
  attachmentId: string;
  /** Authored by the actor, signed off (revision A frozen), checked by the keeper: to revise. */
  signedWorksheetId: string;
}

export async function createOrgWorld(t: TestApp, actorRoles: Role[]): Promise<OrgWorld> {
  const fx = await createOrgWithMembers(t, {
    actor: actorRoles,
    keeper: ['admin'],
    target: ['author'],
    checker: ['checker'],
    approver: ['approver'],
  });
  const invitationId = await createPendingInvitation(
    t,
    fx.org.id,
    fx.people.keeper!.id,
    uniqueEmail('invitee'),
  );
  const [actorId, keeperId, targetUserId] = [
    fx.people.actor!.id,
    fx.people.keeper!.id,
    fx.people.target!.id,
  ];
  const projectId = await insertProjectRow(t, fx.org.id, keeperId);
  const worksheetId = await insertWorksheetRow(t, {
    orgId: fx.org.id,
    projectId,
    authorId: actorId,
    checkerId: fx.people.checker!.id,
    approverId: fx.people.approver!.id,
    engineVersion: '0.0.0-fixture',
  });
  const assignedWorksheetId = await insertWorksheetRow(t, {
    orgId: fx.org.id,
    projectId,
    authorId: targetUserId,
    checkerId: keeperId,
  });
  const inCheckWorksheetId = await insertWorksheetRow(t, {
    orgId: fx.org.id,
    projectId,
    authorId: targetUserId,
    checkerId: actorId,
    approverId: fx.people.approver!.id,
    state: 'in_check',
    frozen: true,
  });
  const checkedWorksheetId = await insertWorksheetRow(t, {
    orgId: fx.org.id,
    projectId,
    authorId: targetUserId,
    checkerId: keeperId,
    checkedById: keeperId,
    approverId: actorId,
    state: 'checked',
    frozen: true,
  });
  const finding = (worksheetId: string, status: 'open' | 'closed' = 'open') =>
    insertFindingRow(t, { orgId: fx.org.id, worksheetId, createdById: keeperId, status });
  const findingId = await finding(worksheetId);
  const reviewFindingId = await finding(inCheckWorksheetId);
  const closedFindingId = await finding(inCheckWorksheetId, 'closed');
  const modelId = await insertModelRow(t, fx.org.id, keeperId);
  // The actor watches the checked worksheet, so that stopping to watch it is a change.
  await inTransaction(t.sequelize, 'system', (tx) =>
    tx.sequelize.query(
      'INSERT INTO worksheet_watchers (org_id, worksheet_id, user_id) VALUES ($1, $2, $3)',
      { bind: [fx.org.id, checkedWorksheetId, actorId], transaction: tx.transaction },
    ),
  );
  const attachmentId = await insertAttachmentRow(t, {
    orgId: fx.org.id,
    worksheetId,
    uploadedById: actorId,
  });
  const signedWorksheetId = await insertWorksheetRow(t, {
    orgId: fx.org.id,
    projectId,
    authorId: actorId,
    checkerId: keeperId,
    checkedById: keeperId,
    approverId: fx.people.approver!.id,
    state: 'signed_off',
    frozen: true,
  });
  return {
    ...fx,
    actorId,
    keeperId,
    targetUserId,
    invitationId,
    projectId,
    worksheetId,
    assignedWorksheetId,
    inCheckWorksheetId,
    checkedWorksheetId,
    findingId,
    reviewFindingId,
    closedFindingId,
    modelId,
    attachmentId,
    signedWorksheetId,
  };
}

/** The world with every object id malformed (the organization id stays). */
export function malformedIds(w: OrgWorld): OrgWorld {
  return {
    ...w,
    targetUserId: 'x',
    invitationId: '1; DROP TABLE users',
    projectId: 'not-a-uuid',
    worksheetId: "' OR 1=1 --",
    assignedWorksheetId: '00000000-0000-0000-0000',
    inCheckWorksheetId: 'in-check',
    checkedWorksheetId: '../checked',
    findingId: 'finding%00',
    reviewFindingId: '-1',
    closedFindingId: 'null',
    modelId: 'model;1',
    attachmentId: 'scope.png',
    signedWorksheetId: "signed'",
  };
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
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  action: Action;
  subject: SubjectName;
  /** Fields of the object the rule is checked against, when the rule has conditions. */
  objectFields?: (w: OrgWorld) => Record<string, unknown>;
  /** The path after `/api/orgs/:orgId`, with the ids of `ids` (usually the same world). */
  path: (ids: OrgWorld) => string;
  body?: (w: OrgWorld) => object;
  /** The 2xx status of an allowed call. */
  success: number;
  /** True when the path names an object inside the organization (then ids from another organization must 404 too). */
  namesObject: boolean;
  /** A multipart upload instead of a JSON body: the `file` part and any other fields. */
  upload?: (w: OrgWorld) => { filename: string; content: Buffer; fields?: Record<string, string> };
  /** A read that is itself audited (downloading an attachment), so the audit chain grows. */
  auditedRead?: boolean;
}

/** Sends the route's body, JSON or multipart, on a request built by a suite. */
export function withRouteBody(req: Test, route: OrgRouteCase, ids: OrgWorld): Test {
  if (route.upload) {
    const { filename, content, fields = {} } = route.upload(ids);
    for (const [name, value] of Object.entries(fields)) void req.field(name, value);
    return req.attach('file', content, filename);
  }
  return route.body ? req.send(route.body(ids)) : req;
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
  {
    name: 'GET /audit/export.csv',
    method: 'get',
    action: 'export',
    subject: 'AuditLog',
    path: () => '/audit/export.csv',
    success: 200,
    namesObject: false,
    auditedRead: true,
  },
  {
    name: 'GET /projects',
    method: 'get',
    action: 'read',
    subject: 'Project',
    path: () => '/projects',
    success: 200,
    namesObject: false,
  },
  {
    name: 'POST /projects',
    method: 'post',
    action: 'create',
    subject: 'Project',
    path: () => '/projects',
    body: () => ({ name: 'Matrix project', code: `MX-${unique()}` }),
    success: 201,
    namesObject: false,
  },
  {
    name: 'GET /projects/:id',
    method: 'get',
    action: 'read',
    subject: 'Project',
    path: (w) => `/projects/${w.projectId}`,
    success: 200,
    namesObject: true,
  },
  {
    name: 'PATCH /projects/:id',
    method: 'patch',
    action: 'update',
    subject: 'Project',
    path: (w) => `/projects/${w.projectId}`,
    body: () => ({ description: 'Changed by the matrix', archived: true }),
    success: 200,
    namesObject: true,
  },
  {
    name: 'GET /worksheets',
    method: 'get',
    action: 'read',
    subject: 'Worksheet',
    path: () => '/worksheets?assignedToMe=false&sort=title',
    success: 200,
    namesObject: false,
  },
  {
    name: 'POST /worksheets',
    method: 'post',
    action: 'create',
    subject: 'Worksheet',
    path: () => '/worksheets',
    body: (w) => ({ projectId: w.projectId, title: 'Matrix worksheet' }),
    success: 201,
    namesObject: false,
  },
  {
    name: 'GET /worksheets/:id',
    method: 'get',
    action: 'read',
    subject: 'Worksheet',
    path: (w) => `/worksheets/${w.worksheetId}`,
    success: 200,
    namesObject: true,
  },
  {
    name: 'PATCH /worksheets/:id',
    method: 'patch',
    action: 'update',
    subject: 'Worksheet',
    objectFields: (w) => ({ authorId: w.actorId }),
    path: (w) => `/worksheets/${w.worksheetId}`,
    body: () => ({ version: 1, title: 'Renamed by the matrix' }),
    success: 200,
    namesObject: true,
  },
  {
    name: 'PATCH /worksheets/:id (assign)',
    method: 'patch',
    action: 'assign',
    subject: 'Worksheet',
    objectFields: (w) => ({ authorId: w.targetUserId }),
    path: (w) => `/worksheets/${w.assignedWorksheetId}`,
    body: () => ({ version: 1, checkerId: null }),
    success: 200,
    namesObject: true,
  },
  {
    name: 'POST /worksheets/:id/compute',
    method: 'post',
    action: 'update',
    subject: 'Worksheet',
    objectFields: (w) => ({ authorId: w.actorId }),
    path: (w) => `/worksheets/${w.worksheetId}/compute`,
    success: 200,
    namesObject: true,
  },
  {
    name: 'GET /worksheets/:id/deck',
    method: 'get',
    action: 'read',
    subject: 'Worksheet',
    path: (w) => `/worksheets/${w.worksheetId}/deck`,
    success: 200,
    namesObject: true,
  },
  {
    name: 'POST /worksheets/:id/deck',
    method: 'post',
    action: 'update',
    subject: 'Worksheet',
    objectFields: (w) => ({ authorId: w.actorId }),
    path: (w) => `/worksheets/${w.worksheetId}/deck`,
    body: () => ({
      text: 'matrix deck\nV1 in 0 9\nR1 in out 2k2\nR2 out 0 1k\n.op\n.end\n',
      version: 1,
    }),
    success: 200,
    namesObject: true,
  },
  {
    name: 'GET /worksheets/:id/actions',
    method: 'get',
    action: 'read',
    subject: 'Worksheet',
    path: (w) => `/worksheets/${w.worksheetId}/actions`,
    success: 200,
    namesObject: true,
  },
  {
    name: 'POST /worksheets/:id/transitions (submit)',
    method: 'post',
    action: 'submit',
    subject: 'Worksheet',
    objectFields: (w) => ({ authorId: w.actorId }),
    path: (w) => `/worksheets/${w.worksheetId}/transitions`,
    body: () => ({ action: 'submit', version: 1 }),
    success: 200,
    namesObject: true,
  },
  {
    name: 'POST /worksheets/:id/transitions (accept)',
    method: 'post',
    action: 'check',
    subject: 'Revision',
    objectFields: (w) => ({ authorId: w.targetUserId, checkerId: w.actorId }),
    path: (w) => `/worksheets/${w.inCheckWorksheetId}/transitions`,
    body: () => ({ action: 'accept', version: 1 }),
    success: 200,
    namesObject: true,
  },
  {
    name: 'POST /worksheets/:id/transitions (sign)',
    method: 'post',
    action: 'sign',
    subject: 'Revision',
    objectFields: (w) => ({ authorId: w.targetUserId, checkerId: w.keeperId }),
    path: (w) => `/worksheets/${w.checkedWorksheetId}/transitions`,
    body: () => ({ action: 'sign', version: 1, meaning: 'Reviewed', password: TEST_PASSWORD }),
    success: 200,
    namesObject: true,
  },
  {
    name: 'GET /worksheets/:id/findings',
    method: 'get',
    action: 'read',
    subject: 'Finding',
    path: (w) => `/worksheets/${w.inCheckWorksheetId}/findings`,
    success: 200,
    namesObject: true,
  },
  {
    name: 'POST /worksheets/:id/findings',
    method: 'post',
    action: 'create',
    subject: 'Finding',
    objectFields: (w) => ({ worksheetAuthorId: w.targetUserId }),
    path: (w) => `/worksheets/${w.inCheckWorksheetId}/findings`,
    body: () => ({ path: 'nodes.out', severity: 'minor', text: 'Raised by the matrix' }),
    success: 201,
    namesObject: true,
  },
  {
    name: 'POST /findings/:findingId/answer',
    method: 'post',
    action: 'answer',
    subject: 'Finding',
    objectFields: (w) => ({ worksheetAuthorId: w.actorId }),
    path: (w) => `/findings/${w.findingId}/answer`,
    body: () => ({ text: 'Answered by the matrix' }),
    success: 200,
    namesObject: true,
  },
  {
    name: 'POST /findings/:findingId/close',
    method: 'post',
    action: 'close',
    subject: 'Finding',
    objectFields: (w) => ({ worksheetAuthorId: w.targetUserId }),
    path: (w) => `/findings/${w.reviewFindingId}/close`,
    body: () => ({ text: 'Closed by the matrix' }),
    success: 200,
    namesObject: true,
  },
  {
    name: 'POST /findings/:findingId/reopen',
    method: 'post',
    action: 'close',
    subject: 'Finding',
    objectFields: (w) => ({ worksheetAuthorId: w.targetUserId }),
    path: (w) => `/findings/${w.closedFindingId}/reopen`,
    success: 200,
    namesObject: true,
  },
  {
    name: 'GET /worksheets/:id/signatures',
    method: 'get',
    action: 'read',
    subject: 'Revision',
    path: (w) => `/worksheets/${w.checkedWorksheetId}/signatures`,
    success: 200,
    namesObject: true,
  },
  {
    name: 'GET /worksheets/:id/watchers',
    method: 'get',
    action: 'read',
    subject: 'Worksheet',
    path: (w) => `/worksheets/${w.worksheetId}/watchers`,
    success: 200,
    namesObject: true,
  },
  {
    name: 'PUT /worksheets/:id/watchers/me',
    method: 'put',
    action: 'read',
    subject: 'Worksheet',
    path: (w) => `/worksheets/${w.assignedWorksheetId}/watchers/me`,
    success: 200,
    namesObject: true,
  },
  {
    name: 'DELETE /worksheets/:id/watchers/me',
    method: 'delete',
    action: 'read',
    subject: 'Worksheet',
    path: (w) => `/worksheets/${w.checkedWorksheetId}/watchers/me`,
    success: 200,
    namesObject: true,
  },
  {
    name: 'GET /models',
    method: 'get',
    action: 'read',
    subject: 'ModelLibrary',
    path: () => '/models',
    success: 200,
    namesObject: false,
  },
  {
    name: 'POST /models',
    method: 'post',
    action: 'create',
    subject: 'ModelLibrary',
    path: () => '/models',
    body: () => ({ name: `MX${unique()}`, kind: 'NPN', params: { IS: 1e-15, BF: 150 } }),
    success: 201,
    namesObject: false,
  },
  {
    name: 'GET /models/:id',
    method: 'get',
    action: 'read',
    subject: 'ModelLibrary',
    path: (w) => `/models/${w.modelId}`,
    success: 200,
    namesObject: true,
  },
  {
    name: 'PATCH /models/:id',
    method: 'patch',
    action: 'update',
    subject: 'ModelLibrary',
    path: (w) => `/models/${w.modelId}`,
    body: () => ({ notes: 'Changed by the matrix' }),
    success: 200,
    namesObject: true,
  },
  {
    name: 'DELETE /models/:id',
    method: 'delete',
    action: 'delete',
    subject: 'ModelLibrary',
    path: (w) => `/models/${w.modelId}`,
    success: 204,
    namesObject: true,
  },
  {
    name: 'POST /worksheets/:id/attachments',
    method: 'post',
    action: 'create',
    subject: 'Attachment',
    objectFields: (w) => ({ worksheetAuthorId: w.actorId }),
    path: (w) => `/worksheets/${w.worksheetId}/attachments`,
    upload: () => ({ filename: 'matrix-scope.png', content: fixturePng() }),
    success: 201,
    namesObject: true,
  },
  {
    name: 'GET /worksheets/:id/attachments',
    method: 'get',
    action: 'read',
    subject: 'Attachment',
    path: (w) => `/worksheets/${w.worksheetId}/attachments`,
    success: 200,
    namesObject: true,
  },
  {
    name: 'GET /attachments/:attachmentId',
    method: 'get',
    action: 'read',
    subject: 'Attachment',
    path: (w) => `/attachments/${w.attachmentId}`,
    success: 200,
    namesObject: true,
    auditedRead: true,
  },
  {
    name: 'DELETE /attachments/:attachmentId',
    method: 'delete',
    action: 'delete',
    subject: 'Attachment',
    objectFields: (w) => ({ worksheetAuthorId: w.actorId, uploadedById: w.actorId }),
    path: (w) => `/attachments/${w.attachmentId}`,
    success: 204,
    namesObject: true,
  },
  {
    name: 'POST /findings/:findingId/replies',
    method: 'post',
    action: 'reply',
    subject: 'Finding',
    objectFields: (w) => ({ worksheetAuthorId: w.actorId }),
    path: (w) => `/findings/${w.findingId}/replies`,
    body: () => ({ text: 'Replied by the matrix' }),
    success: 200,
    namesObject: true,
  },
  {
    name: 'POST /worksheets/:id/transitions (revise)',
    method: 'post',
    action: 'submit',
    subject: 'Worksheet',
    objectFields: (w) => ({ authorId: w.actorId }),
    path: (w) => `/worksheets/${w.signedWorksheetId}/transitions`,
    body: () => ({ action: 'revise', version: 1 }),
    success: 200,
    namesObject: true,
  },
  {
    name: 'GET /worksheets/:id/revisions',
    method: 'get',
    action: 'read',
    subject: 'Revision',
    path: (w) => `/worksheets/${w.signedWorksheetId}/revisions`,
    success: 200,
    namesObject: true,
  },
  {
    name: 'GET /worksheets/:id/revisions/:letter',
    method: 'get',
    action: 'read',
    subject: 'Revision',
    path: (w) => `/worksheets/${w.signedWorksheetId}/revisions/A`,
    success: 200,
    namesObject: true,
  },
  {
    name: 'GET /worksheets/:id/diff',
    method: 'get',
    action: 'read',
    subject: 'Revision',
    path: (w) => `/worksheets/${w.worksheetId}/diff?from=A&to=A`,
    success: 200,
    namesObject: true,
  },
  {
    name: 'GET /queue',
    method: 'get',
    action: 'read',
    subject: 'Worksheet',
    path: () => '/queue',
    success: 200,
    namesObject: false,
  },
  {
    name: 'GET /worksheets/export.csv',
    method: 'get',
    action: 'read',
    subject: 'Worksheet',
    path: () => '/worksheets/export.csv?sort=title',
    success: 200,
    namesObject: false,
  },
  {
    name: 'GET /worksheets/:id/revisions/:letter/report.pdf',
    method: 'get',
    action: 'read',
    subject: 'Revision',
    path: (w) => `/worksheets/${w.worksheetId}/revisions/A/report.pdf`,
    success: 200,
    namesObject: true,
    auditedRead: true,
  },
  {
    name: 'GET /worksheets/:id/revisions/:letter/record.zip',
    method: 'get',
    action: 'read',
    subject: 'Revision',
    path: (w) => `/worksheets/${w.worksheetId}/revisions/A/record.zip`,
    success: 200,
    namesObject: true,
    auditedRead: true,
  },
  {
    name: 'GET /worksheets/:id/revisions/:letter/results.csv',
    method: 'get',
    action: 'read',
    subject: 'Revision',
    path: (w) => `/worksheets/${w.worksheetId}/revisions/A/results.csv?table=bias`,
    success: 200,
    namesObject: true,
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
    projects: await systemRows(
      t,
      'SELECT id, name, code, description, archived, updated_at FROM projects WHERE org_id = $1 ORDER BY id',
      [orgId],
    ),
    worksheets: await systemRows(
      t,
      `SELECT id, project_id, title, description, author_user_id, checker_user_id, approver_user_id,
              checked_by_user_id, state, current_revision, version, updated_at
         FROM worksheets WHERE org_id = $1 ORDER BY id`,
      [orgId],
    ),
    revisions: await systemRows(
      t,
      `SELECT worksheet_id, letter, content_hash, engine_version, frozen, results, updated_at
         FROM revisions WHERE org_id = $1 ORDER BY worksheet_id, letter`,
      [orgId],
    ),
    findings: await systemRows(
      t,
      `SELECT id, worksheet_id, revision_letter, path, severity, text, status, updated_at,
              (SELECT count(*) FROM finding_replies r WHERE r.finding_id = f.id) AS replies
         FROM findings f WHERE org_id = $1 ORDER BY id`,
      [orgId],
    ),
    signatures: await systemRows(t, 'SELECT * FROM signatures WHERE org_id = $1 ORDER BY id', [
      orgId,
    ]),
    models: await systemRows(
      t,
      'SELECT id, name, kind, params, ratings, notes, updated_at FROM model_library_entries WHERE org_id = $1 ORDER BY id',
      [orgId],
    ),
    attachments: await systemRows(
      t,
      `SELECT id, worksheet_id, finding_id, revision_letter, filename, size, sha256
         FROM attachments WHERE org_id = $1 ORDER BY id`,
      [orgId],
    ),
    watchers: await systemRows(
      t,
      'SELECT worksheet_id, user_id FROM worksheet_watchers WHERE org_id = $1 ORDER BY worksheet_id, user_id',
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
