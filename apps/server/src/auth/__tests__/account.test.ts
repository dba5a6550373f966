import { afterAll, describe, expect, it } from 'vitest';
import { createTestApp } from '../../test-support/test-app.ts';
import {
  anonymousAgent,
  createOrgWithMembers,
  signIn,
  systemRows,
} from '../../test-support/fixtures.ts';

describe('profile and password change', () => {
  const t = createTestApp();
  afterAll(() => t.close());

  it('when a person renames themselves, then the answer and the stored row show the new name and the change is audited', async () => {
    const { people } = await createOrgWithMembers(t, { ada: ['author'] });
    const { agent, csrf } = await signIn(t, people.ada!);

    const res = await agent
      .patch('/api/auth/me')
      .set('x-csrf-token', csrf)
      .send({ name: '  Ada Q. Fixture ' });

    expect(res.status).toBe(200);
    expect(res.body.user).toEqual({
      id: people.ada!.id,
      email: people.ada!.email,
      name: 'Ada Q. Fixture',
    });
    const [row] = await systemRows<{ name: string }>(t, 'SELECT name FROM users WHERE id = $1', [
      people.ada!.id,
    ]);
    expect(row?.name).toBe('Ada Q. Fixture');
    const [event] = await systemRows<{ details: unknown }>(
      t,
      `SELECT details FROM audit_events WHERE action = 'account.renamed' AND target_id = $1`,
      [people.ada!.id],
    );
    expect(event?.details).toEqual({ from: people.ada!.name, to: 'Ada Q. Fixture' });
  });

  it('when the current password is wrong, then it answers 400 on that field and the password stays', async () => {
    const { people } = await createOrgWithMembers(t, { ben: ['author'] });
    const { agent, csrf } = await signIn(t, people.ben!);
    const [before] = await systemRows<{ password_hash: string }>(
      t,
      'SELECT password_hash FROM users WHERE id = $1',
      [people.ben!.id],
    );

    const res = await agent
      .post('/api/auth/me/password')
      .set('x-csrf-token', csrf)
      .send({ currentPassword: 'not-my-password', newPassword: 'fresh-bias-point-2026' });

    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({
      currentPassword: 'This is not your current password.',
    });
    const [after] = await systemRows<{ password_hash: string }>(
      t,
      'SELECT password_hash FROM users WHERE id = $1',
      [people.ben!.id],
    );
    expect(after).toEqual(before);
  });

  it('when the password is changed, then other sessions end, this one continues and the new password signs in', async () => {
    const { people } = await createOrgWithMembers(t, { cleo: ['checker'] });
    const here = await signIn(t, people.cleo!);
    const elsewhere = await signIn(t, people.cleo!);

    const res = await here.agent
      .post('/api/auth/me/password')
      .set('x-csrf-token', here.csrf)
      .send({ currentPassword: people.cleo!.password, newPassword: 'fresh-bias-point-2026' });

    expect(res.status).toBe(204);
    expect((await here.agent.get('/api/auth/me')).status).toBe(200);
    expect((await elsewhere.agent.get('/api/auth/me')).status).toBe(401);
    const { agent, csrf } = await anonymousAgent(t);
    const signInRes = await agent
      .post('/api/auth/sign-in')
      .set('x-csrf-token', csrf)
      .send({ email: people.cleo!.email, password: 'fresh-bias-point-2026' });
    expect(signInRes.status).toBe(200);
    const [hash] = await systemRows<{ password_hash: string }>(
      t,
      'SELECT password_hash FROM users WHERE id = $1',
      [people.cleo!.id],
    );
    expect(hash?.password_hash).toMatch(/^\$argon2id\$/);
  });
});
