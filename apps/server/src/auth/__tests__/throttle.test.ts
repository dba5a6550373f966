import { randomInt } from 'node:crypto';
import { afterAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestApp, type TestApp } from '../../test-support/test-app.ts';
import { createOrgWithMembers, systemRows, uniqueEmail } from '../../test-support/fixtures.ts';

// Each test signs in from its own documentation-range address (RFC 3849) through a trusted
// proxy header, so per-address counters of one test never touch another's.
const newIp = () =>
  `2001:db8::${randomInt(1, 0xffff).toString(16)}:${randomInt(1, 0xffff).toString(16)}`;

async function attempt(t: TestApp, ip: string, email: string, password: string) {
  const agent = request.agent(t.app);
  const csrf = await agent.get('/api/auth/csrf').set('x-forwarded-for', ip);
  return agent
    .post('/api/auth/sign-in')
    .set('x-forwarded-for', ip)
    .set('x-csrf-token', csrf.body.token)
    .send({ email, password });
}

const lockEvents = (t: TestApp, since: Date) =>
  systemRows<{ target_type: string; target_id: string | null; details: Record<string, unknown> }>(
    t,
    `SELECT target_type, target_id, details FROM audit_events WHERE action = 'auth.locked' AND at >= $1 ORDER BY seq`,
    [since],
  );

describe('sign-in throttling', () => {
  const t = createTestApp({
    env: {
      TRUST_PROXY: 'true',
      SIGN_IN_MAX_FAILURES: '3',
      SIGN_IN_MAX_FAILURES_PER_IP: '6',
      SIGN_IN_LOCK_SECONDS: '60',
    },
  });
  const quick = createTestApp({
    env: { TRUST_PROXY: 'true', SIGN_IN_MAX_FAILURES: '2', SIGN_IN_LOCK_SECONDS: '1' },
  });
  afterAll(async () => {
    await t.close();
    await quick.close();
  });

  it('when an account fails its limit, then even the right password answers 429 locked, from any address, and the lock is audited', async () => {
    const { people } = await createOrgWithMembers(t, { ada: ['author'] });
    const ada = people.ada!;
    const since = new Date(Date.now() - 1000);
    const ip = newIp();
    for (let i = 0; i < 3; i += 1)
      expect((await attempt(t, ip, ada.email, 'wrong-password-guess')).status).toBe(401);

    const sameIp = await attempt(t, ip, ada.email, ada.password);
    const otherIp = await attempt(t, newIp(), ada.email, ada.password);

    expect(sameIp.status).toBe(429);
    expect(sameIp.body.error.code).toBe('locked');
    expect(otherIp.status).toBe(429);
    const events = await lockEvents(t, since);
    expect(events.filter((e) => e.target_id === ada.id)).toEqual([
      {
        target_type: 'user',
        target_id: ada.id,
        details: expect.objectContaining({ scope: 'account', email: ada.email, ip }),
      },
    ]);
  });

  it('when an unknown e-mail is tried, then the answers match a real account’s, lock included', async () => {
    const { people } = await createOrgWithMembers(t, { ben: ['author'] });
    const unknown = uniqueEmail('nobody');
    const known: number[] = [];
    const ghost: number[] = [];
    const ip = newIp();
    for (let i = 0; i < 4; i += 1) {
      known.push((await attempt(t, ip, people.ben!.email, 'wrong-password-guess')).status);
      ghost.push((await attempt(t, newIp(), unknown, 'wrong-password-guess')).status);
    }
    expect(known).toEqual([401, 401, 401, 429]);
    expect(ghost).toEqual(known);
  });

  it('when one address fails across many accounts, then that address is locked for everyone while others still sign in', async () => {
    const { people } = await createOrgWithMembers(t, { cleo: ['checker'] });
    const since = new Date(Date.now() - 1000);
    const ip = newIp();
    for (let i = 0; i < 6; i += 1)
      expect((await attempt(t, ip, uniqueEmail('spray'), 'wrong-password-guess')).status).toBe(401);

    expect((await attempt(t, ip, people.cleo!.email, people.cleo!.password)).status).toBe(429);
    expect((await attempt(t, newIp(), people.cleo!.email, people.cleo!.password)).status).toBe(200);
    const events = await lockEvents(t, since);
    expect(events).toContainEqual({
      target_type: 'ip',
      target_id: ip,
      details: expect.objectContaining({ scope: 'ip', ip }),
    });
  });

  it('when a sign-in succeeds, then the account’s failure count starts again', async () => {
    const { people } = await createOrgWithMembers(t, { dora: ['author'] });
    const ip = newIp();
    const statuses: number[] = [];
    for (const password of [
      'wrong-1-password',
      'wrong-2-password',
      people.dora!.password,
      'wrong-3-password',
      'wrong-4-password',
    ]) {
      statuses.push((await attempt(t, ip, people.dora!.email, password)).status);
    }
    expect(statuses).toEqual([401, 401, 200, 401, 401]);
    expect((await attempt(t, ip, people.dora!.email, people.dora!.password)).status).toBe(200);
  });

  it('when the lock time has passed, then the right password works again', async () => {
    const { people } = await createOrgWithMembers(quick, { eli: ['author'] });
    const ip = newIp();
    await attempt(quick, ip, people.eli!.email, 'wrong-password-guess');
    await attempt(quick, ip, people.eli!.email, 'wrong-password-guess');
    expect((await attempt(quick, ip, people.eli!.email, people.eli!.password)).status).toBe(429);
    await new Promise((r) => setTimeout(r, 1_300));
    expect((await attempt(quick, ip, people.eli!.email, people.eli!.password)).status).toBe(200);
  });
});
