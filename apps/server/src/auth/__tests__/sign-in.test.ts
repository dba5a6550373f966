import { afterAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestApp } from '../../test-support/test-app.ts';
import {
  anonymousAgent,
  createOrgWithMembers,
  sessionIdFromCookies,
  signIn,
  systemRows,
} from '../../test-support/fixtures.ts';

interface SessionRow {
  sid: string;
  user_id: string | null;
}
const sessionRow = async (t: ReturnType<typeof createTestApp>, sid: string) =>
  (
    await systemRows<SessionRow>(
      t,
      `SELECT sid, sess->>'userId' AS user_id FROM "session" WHERE sid = $1`,
      [sid],
    )
  )[0];

describe('sign-in, me and sign-out', () => {
  const t = createTestApp();
  afterAll(() => t.close());

  it('when a member signs in with the CSRF token, then the answer is the fixed me shape and a session row holds them', async () => {
    const { org, people } = await createOrgWithMembers(t, { ada: ['admin', 'manager'] });
    const ada = people.ada!;
    const { agent, csrf } = await anonymousAgent(t);

    const res = await agent
      .post('/api/auth/sign-in')
      .set('x-csrf-token', csrf)
      .send({ email: ada.email, password: ada.password });

    expect(res.status).toBe(200);
    expect(res.body).toEqual({
      user: { id: ada.id, email: ada.email, name: ada.name },
      memberships: [
        { orgId: org.id, orgSlug: org.slug, orgName: org.name, roles: ['admin', 'manager'] },
      ],
    });
    const sid = sessionIdFromCookies(res.headers['set-cookie']);
    expect(sid).toBeDefined();
    expect((await sessionRow(t, sid!))?.user_id).toBe(ada.id);
    const me = await agent.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body).toEqual(res.body);
  });

  it('when the e-mail is typed in another case with spaces, then the person still signs in', async () => {
    const { people } = await createOrgWithMembers(t, { ben: ['author'] });
    const { agent, csrf } = await anonymousAgent(t);
    const res = await agent
      .post('/api/auth/sign-in')
      .set('x-csrf-token', csrf)
      .send({ email: `  ${people.ben!.email.toUpperCase()} `, password: people.ben!.password });
    expect(res.status).toBe(200);
    expect(res.body.user.id).toBe(people.ben!.id);
  });

  it('when the password is wrong or the e-mail unknown, then both answer the same 401 and no session is stored', async () => {
    const { people } = await createOrgWithMembers(t, { cleo: ['checker'] });
    const wrong = await anonymousAgent(t);
    const unknown = await anonymousAgent(t);
    const a = await wrong.agent
      .post('/api/auth/sign-in')
      .set('x-csrf-token', wrong.csrf)
      .send({ email: people.cleo!.email, password: 'not-the-right-password' });
    const b = await unknown.agent
      .post('/api/auth/sign-in')
      .set('x-csrf-token', unknown.csrf)
      .send({ email: `nobody.${Date.now()}@fixture.example`, password: 'not-the-right-password' });
    expect(a.status).toBe(401);
    expect(b.status).toBe(401);
    expect(a.body).toEqual({
      error: {
        code: 'invalid-credentials',
        message: 'The e-mail address or password is not right.',
      },
    });
    expect(b.body).toEqual(a.body);
    const rows = await systemRows(t, `SELECT sid FROM "session" WHERE sess->>'userId' = $1`, [
      people.cleo!.id,
    ]);
    expect(rows).toEqual([]);
  });

  it('when nobody is signed in, then /me answers 401', async () => {
    const res = await request(t.app).get('/api/auth/me');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });

  it('when someone signs in, then the session id changes and the pre-sign-in session row is gone (no fixation)', async () => {
    const { people } = await createOrgWithMembers(t, { dora: ['author'] });
    const agent = request.agent(t.app);
    const before = await agent.get('/api/auth/csrf');
    const oldSid = sessionIdFromCookies(before.headers['set-cookie']);
    expect(oldSid).toBeDefined();
    expect(await sessionRow(t, oldSid!)).toBeDefined();

    const res = await agent
      .post('/api/auth/sign-in')
      .set('x-csrf-token', before.body.token)
      .send({ email: people.dora!.email, password: people.dora!.password });

    const newSid = sessionIdFromCookies(res.headers['set-cookie']);
    expect(res.status).toBe(200);
    expect(newSid).toBeDefined();
    expect(newSid).not.toBe(oldSid);
    expect(await sessionRow(t, oldSid!)).toBeUndefined();
    expect((await sessionRow(t, newSid!))?.user_id).toBe(people.dora!.id);
  });

  it('when the session cookie is set, then it is httpOnly, SameSite=Lax and not Secure on plain HTTP by default', async () => {
    const res = await request(t.app).get('/api/auth/csrf');
    const cookie = (res.headers['set-cookie'] as unknown as string[]).find((c) =>
      c.startsWith('biasproof.sid='),
    );
    expect(cookie).toMatch(/; HttpOnly/);
    expect(cookie).toMatch(/; SameSite=Lax/);
    expect(cookie).not.toMatch(/; Secure/);
  });

  it('when a person signs out, then the stored session row is deleted and the cookie stops working', async () => {
    const { people } = await createOrgWithMembers(t, { eli: ['approver'] });
    const { agent, csrf } = await signIn(t, people.eli!);
    const rows = await systemRows<{ sid: string }>(
      t,
      `SELECT sid FROM "session" WHERE sess->>'userId' = $1`,
      [people.eli!.id],
    );
    expect(rows).toHaveLength(1);

    const res = await agent.post('/api/auth/sign-out').set('x-csrf-token', csrf);

    expect(res.status).toBe(204);
    expect(await sessionRow(t, rows[0]!.sid)).toBeUndefined();
    expect((await agent.get('/api/auth/me')).status).toBe(401);
    const events = await systemRows<{ action: string }>(
      t,
      `SELECT action FROM audit_events WHERE org_id IS NULL AND target_id = $1 ORDER BY seq`,
      [people.eli!.id],
    );
    expect(events.map((e) => e.action)).toEqual([
      'account.created',
      'auth.signed-in',
      'auth.signed-out',
    ]);
  });
});

describe('session cookie behind TLS', () => {
  const t = createTestApp({ env: { COOKIE_SECURE: 'true', TRUST_PROXY: 'true' } });
  afterAll(() => t.close());

  it('when COOKIE_SECURE=true and the proxy says https, then the cookie is Secure', async () => {
    const res = await request(t.app).get('/api/auth/csrf').set('x-forwarded-proto', 'https');
    const cookie = (res.headers['set-cookie'] as unknown as string[]).find((c) =>
      c.startsWith('biasproof.sid='),
    );
    expect(cookie).toMatch(/; Secure/);
    expect(cookie).toMatch(/; HttpOnly/);
  });
});
