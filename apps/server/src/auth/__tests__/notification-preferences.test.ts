import { afterAll, describe, expect, it } from 'vitest';
import { createTestApp } from '../../test-support/test-app.ts';
import {
  anonymousAgent,
  createOrgWithMembers,
  signIn,
  systemRows,
} from '../../test-support/fixtures.ts';

describe('e-mail delivery preference', () => {
  const t = createTestApp();
  afterAll(() => t.close());

  const stored = (userId: string) =>
    systemRows<{ delivery: string; digest_hour_utc: number }>(
      t,
      'SELECT delivery, digest_hour_utc FROM mail_preferences WHERE user_id = $1',
      [userId],
    );
  const events = (userId: string) =>
    systemRows<{ details: Record<string, unknown>; summary: string; user_agent: string }>(
      t,
      `SELECT details, summary, user_agent FROM audit_events
        WHERE org_id IS NULL AND target_id = $1 AND action = 'account.notifications-changed' ORDER BY seq`,
      [userId],
    );

  it('when a person never chose, then they get every message immediately', async () => {
    const { people } = await createOrgWithMembers(t, { una: ['author'] });
    const { agent } = await signIn(t, people.una!);

    const res = await agent.get('/api/account/notifications');

    expect(res.status).toBe(200);
    expect(res.body).toEqual({ delivery: 'immediate', digestHourUtc: 7 });
  });

  it('when a person chooses a daily digest, then it is stored for them, answered back and audited once on their account', async () => {
    const { people } = await createOrgWithMembers(t, { vic: ['checker'] });
    const { agent, csrf } = await signIn(t, people.vic!);
    const put = () =>
      agent
        .put('/api/account/notifications')
        .set('x-csrf-token', csrf)
        .set('user-agent', 'Bench browser 1.0')
        .send({ delivery: 'daily-digest', digestHourUtc: 6 });

    const res = await put();
    const again = await put();

    expect(res.status).toBe(200);
    expect(res.body).toEqual({ delivery: 'daily-digest', digestHourUtc: 6 });
    expect(again.body).toEqual(res.body);
    expect(await stored(people.vic!.id)).toEqual([
      { delivery: 'daily-digest', digest_hour_utc: 6 },
    ]);
    expect((await agent.get('/api/account/notifications')).body).toEqual(res.body);
    expect(await events(people.vic!.id)).toEqual([
      {
        details: {
          delivery: 'daily-digest',
          digestHourUtc: 6,
          before: { delivery: 'immediate', digestHourUtc: 7 },
        },
        summary: 'Chose a daily e-mail digest at 06:00 UTC',
        user_agent: 'Bench browser 1.0',
      },
    ]);
  });

  it.each([
    [{ delivery: 'weekly', digestHourUtc: 7 }, 'delivery', 'Choose immediate or daily-digest.'],
    [{ delivery: 'daily-digest', digestHourUtc: 24 }, 'digestHourUtc', 'Use an hour from 0 to 23.'],
    [{ delivery: 'daily-digest', digestHourUtc: 6.5 }, 'digestHourUtc', 'Choose a whole hour.'],
  ])(
    'when the choice is %j, then it answers 400 naming %s and stores nothing',
    async (body, field, message) => {
      const { people } = await createOrgWithMembers(t, { wes: ['author'] });
      const { agent, csrf } = await signIn(t, people.wes!);

      const res = await agent
        .put('/api/account/notifications')
        .set('x-csrf-token', csrf)
        .send(body);

      expect(res.status).toBe(400);
      expect(res.body.error.fields).toEqual({ [field]: message });
      expect(await stored(people.wes!.id)).toEqual([]);
      expect(await events(people.wes!.id)).toEqual([]);
    },
  );

  it('when the CSRF token is missing, then it answers 403 and stores nothing', async () => {
    const { people } = await createOrgWithMembers(t, { xia: ['author'] });
    const { agent } = await signIn(t, people.xia!);

    const res = await agent
      .put('/api/account/notifications')
      .send({ delivery: 'daily-digest', digestHourUtc: 7 });

    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf');
    expect(await stored(people.xia!.id)).toEqual([]);
  });

  it('when nobody is signed in, then both answer 401', async () => {
    const { agent, csrf } = await anonymousAgent(t);

    const get = await agent.get('/api/account/notifications');
    const put = await agent
      .put('/api/account/notifications')
      .set('x-csrf-token', csrf)
      .send({ delivery: 'immediate', digestHourUtc: 7 });

    expect([get.status, put.status]).toEqual([401, 401]);
  });
});
