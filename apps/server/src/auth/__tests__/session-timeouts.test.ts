import { afterAll, describe, expect, it } from 'vitest';
import { createTestApp } from '../../test-support/test-app.ts';
import { createOrgWithMembers, signIn } from '../../test-support/fixtures.ts';

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

// The store keeps expiry in whole seconds (connect-pg-simple), so the waits leave a second of slack.
describe('idle timeout', () => {
  const t = createTestApp({ env: { SESSION_IDLE_TIMEOUT_SECONDS: '2' } });
  afterAll(() => t.close());

  it('when the person keeps working, then each request pushes the idle timeout forward', async () => {
    const { people } = await createOrgWithMembers(t, { ada: ['author'] });
    const { agent } = await signIn(t, people.ada!);
    for (let i = 0; i < 4; i += 1) {
      await sleep(900);
      expect((await agent.get('/api/auth/me')).status).toBe(200);
    }
  });

  it('when the session sits idle longer than the timeout, then the person is signed out', async () => {
    const { people } = await createOrgWithMembers(t, { ben: ['author'] });
    const { agent } = await signIn(t, people.ben!);
    expect((await agent.get('/api/auth/me')).status).toBe(200);
    await sleep(3_500);
    const res = await agent.get('/api/auth/me');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });
});

describe('absolute timeout', () => {
  const t = createTestApp({
    env: { SESSION_IDLE_TIMEOUT_SECONDS: '60', SESSION_ABSOLUTE_TIMEOUT_SECONDS: '2' },
  });
  afterAll(() => t.close());

  it('when a busy session outlives the absolute timeout, then it ends however active it is', async () => {
    const { people } = await createOrgWithMembers(t, { cleo: ['checker'] });
    const { agent } = await signIn(t, people.cleo!);
    expect((await agent.get('/api/auth/me')).status).toBe(200);
    await sleep(1_000);
    expect((await agent.get('/api/auth/me')).status).toBe(200);
    await sleep(1_300);
    expect((await agent.get('/api/auth/me')).status).toBe(401);
  });
});
