import { randomBytes } from 'node:crypto';
import request from 'supertest';
import { QueryTypes } from 'sequelize';
import type { Role, WorksheetState } from '@biasproof/shared';
import { analysisSettingsSchema, type WorksheetDraft } from '@biasproof/calc';
import { computeRevision } from '../calc/compute.ts';
import { inTransaction } from '../db/transactions.ts';
import { createPasswordHasher } from '../auth/passwords.ts';
import { ensureAccount, ensureMembership, ensureOrganization } from '../orgs/provisioning.ts';
import type { TestApp } from './test-app.ts';

/** The password of every fixture person (long enough and not on the common list). */
export const TEST_PASSWORD = 'violet-anode-sweep-4417';

export const unique = () => randomBytes(5).toString('hex');
export const uniqueEmail = (name: string) => `${name}.${unique()}@fixture.example`;

export interface Person {
  id: string;
  email: string;
  name: string;
  password: string;
}

export interface OrgFixture {
  org: { id: string; slug: string; name: string };
  people: Record<string, Person>;
}

/**
 * A fresh organization (random slug) whose members hold the given roles, e.g.
 * `{ ada: ['admin'], ben: ['author', 'checker'] }`; people with no roles get an account only.
 */
export async function createOrgWithMembers(
  t: TestApp,
  members: Record<string, Role[]>,
): Promise<OrgFixture> {
  const slug = `org-${unique()}`;
  const name = `Fixture ${slug}`;
  const org = await ensureOrganization(t.sequelize, { slug, name, timezone: 'Europe/Berlin' });
  const passwords = createPasswordHasher(t.config.argon2);
  const people: Record<string, Person> = {};
  for (const [key, roles] of Object.entries(members)) {
    const person = {
      email: uniqueEmail(key),
      name: `${key[0]?.toUpperCase()}${key.slice(1)} Fixture`,
      password: TEST_PASSWORD,
    };
    const { id } = await ensureAccount(t.sequelize, passwords, person);
    if (roles.length) await ensureMembership(t.sequelize, org.id, id, roles);
    people[key] = { id, ...person };
  }
  return { org: { id: org.id, slug, name }, people };
}

export interface SignedInAgent {
  agent: ReturnType<typeof request.agent>;
  /** The CSRF token of the agent's signed-in session. */
  csrf: string;
}

/** An agent with an anonymous session and its CSRF token. */
export async function anonymousAgent(t: TestApp): Promise<SignedInAgent> {
  const agent = request.agent(t.app);
  const res = await agent.get('/api/auth/csrf').expect(200);
  return { agent, csrf: (res.body as { token: string }).token };
}

/** Signs a person in through the API and returns the agent with a token for its new session. */
export async function signIn(
  t: TestApp,
  person: { email: string; password: string },
): Promise<SignedInAgent> {
  const { agent, csrf } = await anonymousAgent(t);
  await agent
    .post('/api/auth/sign-in')
    .set('x-csrf-token', csrf)
    .send({ email: person.email, password: person.password })
    .expect(200);
  const fresh = await agent.get('/api/auth/csrf').expect(200);
  return { agent, csrf: (fresh.body as { token: string }).token };
}

/** Reads rows the way an operator would: in a transaction that may see every organization. */
export async function systemRows<T extends object>(
  t: TestApp,
  sql: string,
  bind: unknown[] = [],
): Promise<T[]> {
  return inTransaction(t.sequelize, 'system', (tx) =>
    tx.sequelize.query<T>(sql, { bind, transaction: tx.transaction, type: QueryTypes.SELECT }),
  );
}

/** The session id inside a signed `biasproof.sid` cookie (`s:<sid>.<signature>`). */
export function sessionIdFromCookies(setCookie: string[] | string | undefined): string | undefined {
  const cookies = Array.isArray(setCookie) ? setCookie : setCookie ? [setCookie] : [];
  const raw = cookies
    .find((c) => c.startsWith('biasproof.sid='))
    ?.split(';')[0]
    ?.slice('biasproof.sid='.length);
  if (!raw) return undefined;
  const value = decodeURIComponent(raw);
  return value.startsWith('s:') ? value.slice(2, value.lastIndexOf('.')) : value;
}

/** A tiny solvable circuit: a 5 V divider driven by V1, output at node `out`. */
export const dividerDraft = (): WorksheetDraft => ({
  circuit: {
    title: 'fixture divider',
    elements: [
      { kind: 'V', name: 'V1', nodes: ['in', '0'], dc: 5 },
      { kind: 'R', name: 'R1', nodes: ['in', 'out'], value: 1000 },
      { kind: 'R', name: 'R2', nodes: ['out', '0'], value: 1000 },
    ],
    models: [],
  },
  settings: analysisSettingsSchema.parse({ inputSource: 'V1', outputNode: 'out' }),
});

/** A project inserted directly (no API, no audit event), for tests that need one to exist. */
export async function insertProjectRow(
  t: TestApp,
  orgId: string,
  createdByUserId: string,
  fields: { name?: string; code?: string; archived?: boolean } = {},
): Promise<string> {
  return inTransaction(t.sequelize, { orgId }, async (tx) => {
    const row = await tx.models.Project.create(
      {
        orgId,
        name: fields.name ?? 'Fixture project',
        code: fields.code ?? `FX-${unique().toUpperCase()}`,
        archived: fields.archived ?? false,
        createdByUserId,
      },
      { transaction: tx.transaction },
    );
    return row.id;
  });
}

/**
 * A draft worksheet at revision A inserted directly, with the divider circuit computed by the
 * engine. `engineVersion` pretends an older engine computed it (a later recompute then stores
 * new results).
 */
export async function insertWorksheetRow(
  t: TestApp,
  w: {
    orgId: string;
    projectId: string;
    authorId: string;
    checkerId?: string | null;
    approverId?: string | null;
    checkedById?: string | null;
    state?: WorksheetState;
    /** Freeze revision A, as a submission does. */
    frozen?: boolean;
    title?: string;
    engineVersion?: string;
  },
): Promise<string> {
  return inTransaction(t.sequelize, { orgId: w.orgId }, async (tx) => {
    const row = await tx.models.Worksheet.create(
      {
        orgId: w.orgId,
        projectId: w.projectId,
        title: w.title ?? 'Fixture divider',
        authorUserId: w.authorId,
        checkerUserId: w.checkerId ?? null,
        approverUserId: w.approverId ?? null,
        checkedByUserId: w.checkedById ?? null,
        state: w.state ?? 'draft',
      },
      { transaction: tx.transaction },
    );
    const computed = computeRevision(dividerDraft());
    await tx.models.Revision.create(
      {
        ...computed,
        engineVersion: w.engineVersion ?? computed.engineVersion,
        orgId: w.orgId,
        worksheetId: row.id,
        letter: 'A',
        createdByUserId: w.authorId,
        frozen: w.frozen ?? false,
      },
      { transaction: tx.transaction },
    );
    return row.id;
  });
}

/** A model library entry inserted directly. */
export async function insertModelRow(
  t: TestApp,
  orgId: string,
  createdByUserId: string,
  name = `FXD${unique()}`,
): Promise<string> {
  return inTransaction(t.sequelize, { orgId }, async (tx) => {
    const row = await tx.models.ModelLibraryEntry.create(
      { orgId, name, kind: 'D', params: { IS: 1e-14, N: 1.8 }, createdByUserId },
      { transaction: tx.transaction },
    );
    return row.id;
  });
}

/** A finding inserted directly (no API, no audit event). */
export async function insertFindingRow(
  t: TestApp,
  f: {
    orgId: string;
    worksheetId: string;
    createdById: string;
    severity?: 'note' | 'minor' | 'major';
    status?: 'open' | 'answered' | 'closed';
    path?: string;
  },
): Promise<string> {
  const [row] = await systemRows<{ id: string }>(
    t,
    `INSERT INTO findings (org_id, worksheet_id, revision_letter, path, severity, text, status, created_by_user_id)
     VALUES ($1, $2, 'A', $3, $4, 'Fixture finding', $5, $6) RETURNING id`,
    [
      f.orgId,
      f.worksheetId,
      f.path ?? 'nodes.out',
      f.severity ?? 'minor',
      f.status ?? 'open',
      f.createdById,
    ],
  );
  return row!.id;
}

/** Bytes the attachment sniffer types as PNG: the 8-byte signature and a 1×1 IHDR chunk. */
export const fixturePng = (): Buffer =>
  Buffer.from('89504e470d0a1a0a0000000d49484452000000010000000108060000001f15c489', 'hex');

/** An attachment inserted directly (no API, no audit event) on revision A of a worksheet. */
export async function insertAttachmentRow(
  t: TestApp,
  a: {
    orgId: string;
    worksheetId: string;
    uploadedById: string;
    findingId?: string | null;
    filename?: string;
  },
): Promise<string> {
  const content = fixturePng();
  const [row] = await systemRows<{ id: string }>(
    t,
    `INSERT INTO attachments (org_id, worksheet_id, finding_id, revision_letter, filename, type,
                              content_type, size, sha256, content, uploaded_by_user_id)
     VALUES ($1, $2, $3, 'A', $4, 'png', 'image/png', $5, encode(sha256($6::bytea), 'hex'), $6, $7)
     RETURNING id`,
    [
      a.orgId,
      a.worksheetId,
      a.findingId ?? null,
      a.filename ?? 'fixture-scope.png',
      content.length,
      content,
      a.uploadedById,
    ],
  );
  return row!.id;
}
