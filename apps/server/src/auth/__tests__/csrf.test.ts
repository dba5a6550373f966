import { afterAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestApp } from '../../test-support/test-app.ts';
import {
  anonymousAgent,
  createOrgWithMembers,
  signIn,
  systemRows,
} from '../../test-support/fixtures.ts';

const csrfError = {
  error: {
    code: 'csrf',
    message: 'The security token is missing or out of date; reload the page and try again.',
  },
};

describe('CSRF protection', () => {
  const t = createTestApp();
  afterAll(() => t.close());

  it('when the token is fetched, then the answer is {"token"} and repeated fetches in one session keep working', async () => {
    const agent = request.agent(t.app);
    const a = await agent.get('/api/auth/csrf');
    expect(a.status).toBe(200);
    expect(Object.keys(a.body)).toEqual(['token']);
    expect(typeof a.body.token).toBe('string');
    const b = await agent.get('/api/auth/csrf');
    expect(b.body.token).toBe(a.body.token);
  });

  it('when sign-in comes without a token or with a wrong one, then it answers 403 csrf and nobody is signed in', async () => {
    const { people } = await createOrgWithMembers(t, { ada: ['admin'] });
    const { agent, csrf } = await anonymousAgent(t);
    const body = { email: people.ada!.email, password: people.ada!.password };

    const missing = await agent.post('/api/auth/sign-in').send(body);
    const wrong = await agent
      .post('/api/auth/sign-in')
      .set('x-csrf-token', `${csrf.slice(0, -4)}abcd`)
      .send(body);

    expect(missing.status).toBe(403);
    expect(missing.body).toEqual(csrfError);
    expect(wrong.status).toBe(403);
    expect(wrong.body).toEqual(csrfError);
    expect((await agent.get('/api/auth/me')).status).toBe(401);
    const sessions = await systemRows(t, `SELECT sid FROM "session" WHERE sess->>'userId' = $1`, [
      people.ada!.id,
    ]);
    expect(sessions).toEqual([]);
  });

  it('when a token from another session is sent, then it is refused', async () => {
    const { people } = await createOrgWithMembers(t, { ben: ['author'] });
    const other = await anonymousAgent(t);
    const { agent } = await anonymousAgent(t);
    const res = await agent
      .post('/api/auth/sign-in')
      .set('x-csrf-token', other.csrf)
      .send({ email: people.ben!.email, password: people.ben!.password });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf');
  });

  it('when signed in, then the pre-sign-in token no longer works and the token from the sign-in answer does', async () => {
    const { people } = await createOrgWithMembers(t, { cleo: ['author'] });
    const { agent, csrf } = await anonymousAgent(t);
    const signInRes = await agent
      .post('/api/auth/sign-in')
      .set('x-csrf-token', csrf)
      .send({ email: people.cleo!.email, password: people.cleo!.password });
    const fresh = signInRes.headers['x-csrf-token'] as string;
    expect(fresh).toBeTruthy();

    const stale = await agent
      .patch('/api/auth/me')
      .set('x-csrf-token', csrf)
      .send({ name: 'Cleo Stale' });
    expect(stale.status).toBe(403);
    const ok = await agent
      .patch('/api/auth/me')
      .set('x-csrf-token', fresh)
      .send({ name: 'Cleo Fresh' });
    expect(ok.status).toBe(200);
    const [row] = await systemRows<{ name: string }>(t, 'SELECT name FROM users WHERE id = $1', [
      people.cleo!.id,
    ]);
    expect(row?.name).toBe('Cleo Fresh');
  });

  it('when any mutating route is called without the token, then it answers 403 csrf and nothing changes', async () => {
    const { org, people } = await createOrgWithMembers(t, { dora: ['admin'], eli: ['author'] });
    const { agent } = await signIn(t, people.dora!);
    const invite = await agent
      .post(`/api/orgs/${org.id}/invitations`)
      .set('x-csrf-token', (await agent.get('/api/auth/csrf')).body.token)
      .send({ email: `fay.${Date.now()}@fixture.example`, roles: ['checker'] });
    expect(invite.status).toBe(201);
    const before = await systemRows(
      t,
      `SELECT (SELECT count(*) FROM audit_events) AS events, (SELECT count(*) FROM memberships WHERE org_id = $1) AS members,
              (SELECT count(*) FROM invitations WHERE org_id = $1 AND revoked_at IS NULL) AS open_invitations`,
      [org.id],
    );

    const calls = [
      agent.post('/api/auth/sign-out'),
      agent.patch('/api/auth/me').send({ name: 'Dora Changed' }),
      agent
        .post('/api/auth/me/password')
        .send({ currentPassword: people.dora!.password, newPassword: 'a-new-long-password-77' }),
      agent.post('/api/auth/password-reset').send({ email: people.dora!.email }),
      agent
        .post('/api/auth/password-reset/confirm')
        .send({ token: 'x'.repeat(43), password: 'a-new-long-password-77' }),
      agent.post('/api/invitations/some-token/accept').send({}),
      agent.patch(`/api/orgs/${org.id}/members/${people.eli!.id}`).send({ roles: ['checker'] }),
      agent.delete(`/api/orgs/${org.id}/members/${people.eli!.id}`),
      agent
        .post(`/api/orgs/${org.id}/invitations`)
        .send({ email: `gus.${Date.now()}@fixture.example`, roles: ['author'] }),
      agent.post(`/api/orgs/${org.id}/invitations/${invite.body.id}/resend`),
      agent.delete(`/api/orgs/${org.id}/invitations/${invite.body.id}`),
    ];
    for (const [i, call] of calls.entries()) {
      const res = await call;
      expect(res.status, `call ${i}`).toBe(403);
      expect(res.body).toEqual(csrfError);
    }

    expect((await agent.get('/api/auth/me')).status).toBe(200);
    const after = await systemRows(
      t,
      `SELECT (SELECT count(*) FROM audit_events) AS events, (SELECT count(*) FROM memberships WHERE org_id = $1) AS members,
              (SELECT count(*) FROM invitations WHERE org_id = $1 AND revoked_at IS NULL) AS open_invitations`,
      [org.id],
    );
    expect(after).toEqual(before);
    const [dora] = await systemRows<{ name: string }>(t, 'SELECT name FROM users WHERE id = $1', [
      people.dora!.id,
    ]);
    expect(dora?.name).toBe(people.dora!.name);
  });
});
