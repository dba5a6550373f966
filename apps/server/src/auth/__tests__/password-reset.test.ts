import { afterAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestApp, type TestApp } from '../../test-support/test-app.ts';
import {
  anonymousAgent,
  createOrgWithMembers,
  signIn,
  systemRows,
  uniqueEmail,
} from '../../test-support/fixtures.ts';
import { listEmails, waitForEmail, waitForEmailWhere } from '../../test-support/maildev.ts';
import { hashToken } from '../tokens.ts';

async function requestReset(t: TestApp, email: string) {
  const { agent, csrf } = await anonymousAgent(t);
  return agent.post('/api/auth/password-reset').set('x-csrf-token', csrf).send({ email });
}

async function confirmReset(t: TestApp, token: string, password: string) {
  const { agent, csrf } = await anonymousAgent(t);
  return agent
    .post('/api/auth/password-reset/confirm')
    .set('x-csrf-token', csrf)
    .send({ token, password });
}

async function canSignIn(t: TestApp, email: string, password: string): Promise<boolean> {
  const { agent, csrf } = await anonymousAgent(t);
  return (
    (await agent.post('/api/auth/sign-in').set('x-csrf-token', csrf).send({ email, password }))
      .status === 200
  );
}

/** Asks for a reset and returns the token from the e-mailed link. */
async function resetTokenFor(t: TestApp, email: string): Promise<string> {
  expect((await requestReset(t, email)).status).toBe(202);
  const mail = await waitForEmail(email, /Reset your Biasproof password/);
  const link = /http:\/\/biasproof\.test\.example\/reset-password\?token=([A-Za-z0-9_-]+)/.exec(
    mail.text ?? '',
  );
  expect(link).not.toBeNull();
  return link![1]!;
}

describe('password reset', () => {
  const t = createTestApp();
  afterAll(() => t.close());

  it('when an address with and one without an account ask, then both get the same answer and only the account gets an e-mail', async () => {
    const { people } = await createOrgWithMembers(t, { ada: ['author'] });
    const stranger = uniqueEmail('stranger');

    const known = await requestReset(t, people.ada!.email);
    const unknown = await requestReset(t, stranger);

    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(unknown.body).toEqual(known.body);
    const mail = await waitForEmail(people.ada!.email, /Reset your Biasproof password/);
    const token = /token=([A-Za-z0-9_-]+)/.exec(mail.text ?? '')![1]!;
    expect(token).toHaveLength(43); // 32 random bytes in base64url
    const rows = await systemRows<{ token_hash: string; expires_at: Date }>(
      t,
      'SELECT token_hash, expires_at FROM password_resets WHERE user_id = $1',
      [people.ada!.id],
    );
    expect(rows).toHaveLength(1);
    expect(rows[0]!.token_hash).toBe(hashToken(token));
    expect(rows[0]!.token_hash).not.toContain(token);
    const ttl = new Date(rows[0]!.expires_at).getTime() - Date.now();
    expect(ttl).toBeGreaterThan(59 * 60 * 1000);
    expect(ttl).toBeLessThanOrEqual(60 * 60 * 1000);
    expect((await listEmails()).some((m) => m.to.some((a) => a.address === stranger))).toBe(false);
  });

  it('when the link is used, then the new password works, the old does not, every session ends, and the link cannot be used again', async () => {
    const { people } = await createOrgWithMembers(t, { ben: ['author'] });
    const ben = people.ben!;
    const laptop = await signIn(t, ben);
    const phone = await signIn(t, ben);
    const token = await resetTokenFor(t, ben.email);

    const res = await confirmReset(t, token, 'fresh-bias-point-2026');

    expect(res.status).toBe(204);
    expect((await laptop.agent.get('/api/auth/me')).status).toBe(401);
    expect((await phone.agent.get('/api/auth/me')).status).toBe(401);
    expect(
      await systemRows(t, `SELECT sid FROM "session" WHERE sess->>'userId' = $1`, [ben.id]),
    ).toEqual([]);
    expect(await canSignIn(t, ben.email, ben.password)).toBe(false);
    expect(await canSignIn(t, ben.email, 'fresh-bias-point-2026')).toBe(true);

    const again = await confirmReset(t, token, 'another-bias-point-2027');
    expect(again.status).toBe(400);
    expect(again.body.error.code).toBe('reset-token-used');
    expect(await canSignIn(t, ben.email, 'another-bias-point-2027')).toBe(false);
    const events = await systemRows<{ action: string }>(
      t,
      `SELECT action FROM audit_events WHERE org_id IS NULL AND target_id = $1 AND action LIKE 'auth.password-reset%' ORDER BY seq`,
      [ben.id],
    );
    expect(events.map((e) => e.action)).toEqual([
      'auth.password-reset-requested',
      'auth.password-reset',
    ]);
  });

  it('when the link is older than an hour, then it answers reset-token-expired and the password stays', async () => {
    const { people } = await createOrgWithMembers(t, { cleo: ['checker'] });
    const token = await resetTokenFor(t, people.cleo!.email);
    await systemRows(
      t,
      `UPDATE password_resets SET expires_at = now() - interval '1 second' WHERE token_hash = $1 RETURNING id`,
      [hashToken(token)],
    );

    const res = await confirmReset(t, token, 'fresh-bias-point-2026');

    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('reset-token-expired');
    expect(await canSignIn(t, people.cleo!.email, people.cleo!.password)).toBe(true);
  });

  it('when a newer reset is completed, then older links of that person stop working', async () => {
    const { people } = await createOrgWithMembers(t, { dora: ['author'] });
    const first = await resetTokenFor(t, people.dora!.email);
    expect((await requestReset(t, people.dora!.email)).status).toBe(202);
    const tokenOf = (text: string | undefined) => /token=([A-Za-z0-9_-]+)/.exec(text ?? '')?.[1];
    const secondMail = await waitForEmailWhere(people.dora!.email, (m) => {
      const token = tokenOf(m.text);
      return Boolean(token && token !== first);
    });
    const second = tokenOf(secondMail.text);
    expect((await confirmReset(t, second!, 'fresh-bias-point-2026')).status).toBe(204);
    const res = await confirmReset(t, first, 'other-bias-point-2027');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('reset-token-used');
  });

  it('when the token is unknown, then it answers reset-token-invalid', async () => {
    const res = await confirmReset(t, 'A'.repeat(43), 'fresh-bias-point-2026');
    expect(res.status).toBe(400);
    expect(res.body).toEqual({
      error: {
        code: 'reset-token-invalid',
        message: 'This reset link is not valid. Ask for a new one.',
      },
    });
  });

  it('when the new password is too short or common, then it answers 400 with the field message and the link still works', async () => {
    const { people } = await createOrgWithMembers(t, { eli: ['author'] });
    const token = await resetTokenFor(t, people.eli!.email);

    const short = await confirmReset(t, token, 'short');
    const common = await confirmReset(t, token, 'Password1234');

    expect(short.status).toBe(400);
    expect(short.body.error.fields).toEqual({ password: 'Use at least 12 characters.' });
    expect(common.status).toBe(400);
    expect(common.body.error.fields).toEqual({
      password: 'This password is too common; choose another.',
    });
    expect((await confirmReset(t, token, 'fresh-bias-point-2026')).status).toBe(204);
  });

  it('when one address asks too often, then it is throttled with 429', async () => {
    const limited = createTestApp({ env: { PASSWORD_RESET_REQUESTS_PER_IP: '2' } });
    try {
      const email = uniqueEmail('often');
      const agent = request.agent(limited.app);
      const csrf = (await agent.get('/api/auth/csrf')).body.token as string;
      const statuses: number[] = [];
      for (let i = 0; i < 3; i += 1) {
        statuses.push(
          (await agent.post('/api/auth/password-reset').set('x-csrf-token', csrf).send({ email }))
            .status,
        );
      }
      expect(statuses).toEqual([202, 202, 429]);
    } finally {
      await limited.close();
    }
  });
});
