// An organization with one person per role (two authors) signed in, and a small API client
// per person, for the project, worksheet and model library tests.
import { expect } from 'vitest';
import type { z } from 'zod';
import { canonicalJson } from '@biasproof/shared';
import type { Role } from '@biasproof/shared';
import {
  createOrgWithMembers,
  signIn,
  systemRows,
  type OrgFixture,
  type SignedInAgent,
} from './fixtures.ts';
import type { TestApp } from './test-app.ts';

export const teamRoles = {
  ann: ['author'],
  bob: ['author'],
  kim: ['checker'],
  abe: ['approver'],
  max: ['manager'],
  ada: ['admin'],
  /** Holds every role of the review, to try separation of duties. */
  cal: ['author', 'checker', 'approver'],
} satisfies Record<string, Role[]>;
export type TeamMember = keyof typeof teamRoles;

/** Calls of one signed-in person under `/api/orgs/:orgId` (CSRF header included). */
export function orgApi({ agent, csrf }: SignedInAgent, orgId: string) {
  const url = (path: string) => `/api/orgs/${orgId}${path}`;
  return {
    get: (path: string) => agent.get(url(path)),
    post: (path: string, body?: object) =>
      agent.post(url(path)).set('x-csrf-token', csrf).send(body),
    put: (path: string, body?: object) => agent.put(url(path)).set('x-csrf-token', csrf).send(body),
    patch: (path: string, body: object) =>
      agent.patch(url(path)).set('x-csrf-token', csrf).send(body),
    delete: (path: string) => agent.delete(url(path)).set('x-csrf-token', csrf),
    /** A raw request, e.g. to send a text/plain body. */
    agent,
    csrf,
    url,
  };
}
export type OrgApi = ReturnType<typeof orgApi>;

export interface Team extends OrgFixture {
  as: Record<TeamMember, OrgApi>;
}

export async function createTeam(t: TestApp): Promise<Team> {
  const fx = await createOrgWithMembers(t, teamRoles);
  const as = {} as Record<TeamMember, OrgApi>;
  for (const key of Object.keys(teamRoles) as TeamMember[]) {
    as[key] = orgApi(await signIn(t, fx.people[key]!), fx.org.id);
  }
  return { ...fx, as };
}

/** Creates a project through the API and returns its body. */
export async function newProject(
  api: OrgApi,
  fields: { name?: string; code?: string; description?: string } = {},
) {
  const res = await api.post('/projects', {
    name: fields.name ?? 'Bench supply monitor',
    code: fields.code ?? `P${Math.random().toString(36).slice(2, 8)}`,
    description: fields.description ?? '',
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body as { id: string; code: string; name: string };
}

/** Creates a worksheet through the API and returns its body. */
export async function newWorksheet(api: OrgApi, projectId: string, fields: object = {}) {
  const res = await api.post('/worksheets', { projectId, title: 'Divider', ...fields });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body as WorksheetBody;
}

export interface WorksheetBody {
  id: string;
  title: string;
  state: string;
  version: number;
  revision: string;
  checker: { id: string; name: string } | null;
  approver: { id: string; name: string } | null;
  currentRevision: {
    letter: string;
    circuit: { elements: { name: string; value?: number }[] };
    settings: Record<string, unknown>;
    results: { status: string } & Record<string, unknown>;
    engineVersion: string;
    contentHash: string;
    frozen: boolean;
  };
}

/**
 * The body is exactly what the shared schema describes: it parses and parsing drops nothing.
 * Compared as canonical JSON, so results whose parse turns "Infinity" back into a number still match.
 */
export function expectShape(schema: z.ZodType, body: unknown): void {
  const parsed = schema.safeParse(body);
  expect(parsed.error).toBeUndefined();
  expect(canonicalJson(parsed.data)).toBe(canonicalJson(body));
}

/** The organization's audit events of one action, oldest first. */
export function auditEvents(t: TestApp, orgId: string, action: string) {
  return systemRows<{ actor_user_id: string; target_id: string; details: Record<string, unknown> }>(
    t,
    'SELECT actor_user_id, target_id, details FROM audit_events WHERE org_id = $1 AND action = $2 ORDER BY seq',
    [orgId, action],
  );
}

/** The stored rows of one worksheet and its revisions. */
export async function storedWorksheet(t: TestApp, id: string) {
  const [worksheet] = await systemRows<Record<string, unknown>>(
    t,
    'SELECT * FROM worksheets WHERE id = $1',
    [id],
  );
  const revisions = await systemRows<Record<string, unknown>>(
    t,
    'SELECT * FROM revisions WHERE worksheet_id = $1 ORDER BY letter',
    [id],
  );
  return { worksheet, revisions };
}

/** One field of every item of a list answer, in order. */
export function pluck(body: unknown, field: string): unknown[] {
  return (body as { items: Record<string, unknown>[] }).items.map((item) => item[field]);
}
