import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  anonymousAgent,
  createOrgWithMembers,
  signIn,
  uniqueEmail,
  type OrgFixture,
} from '../../test-support/fixtures.ts';
import type { CapturedEmail } from '../../test-support/maildev.ts';
import { dispatchOutbox } from '../dispatcher.ts';
import { createOutboxWorld, outboxRows, type OutboxWorld } from './outbox-world.ts';

describe('invitations and password resets through the outbox', () => {
  let w: OutboxWorld;
  let fx: OrgFixture;
  beforeAll(async () => {
    w = await createOutboxWorld();
    fx = await createOrgWithMembers(w.t, { admin: ['admin'], rosa: ['author'] });
  });
  afterAll(() => w.close());

  async function mailTo(address: string, timeoutMs = 10_000): Promise<CapturedEmail> {
    const deadline = Date.now() + timeoutMs;
    while (Date.now() < deadline) {
      const found = (await w.maildev.list()).find((m) => m.to[0]?.address === address);
      if (found) return found;
      await new Promise((r) => setTimeout(r, 100));
    }
    throw new Error(`no e-mail to ${address}`);
  }

  async function invite(email: string) {
    const admin = await signIn(w.t, fx.people.admin!);
    return admin.agent
      .post(`/api/orgs/${fx.org.id}/invitations`)
      .set('x-csrf-token', admin.csrf)
      .send({ email, roles: ['checker'] });
  }

  it('when an admin invites someone, then the e-mail is written to the outbox with the invitation and sent at once, in text and HTML', async () => {
    const email = uniqueEmail('iris');

    const res = await invite(email);

    expect(res.status).toBe(201);
    const mail = await mailTo(email);
    const link = /http:\/\/biasproof\.test\.example\/invitations\/[A-Za-z0-9_-]{43}/.exec(
      mail.text ?? '',
    )?.[0];
    expect(link).toBeDefined();
    expect(mail.subject).toBe(`Admin Fixture invited you to ${fx.org.name} on Biasproof`);
    expect(mail.text).toContain(`Accept the invitation: ${link}`);
    expect(mail.html).toMatch(new RegExp(`<a [^>]*href="${link}"[^>]*>Accept the invitation</a>`));
    const [row] = await outboxRows(w.t, 'to_address = $1', [email]);
    expect(row).toMatchObject({ org_id: fx.org.id, kind: 'invitation.created', link, attempts: 1 });
    expect(row!.sent_at).not.toBeNull();
  });

  it('when SMTP is down as an admin invites, then the invitation is kept and its e-mail goes out once the mail server is back', async () => {
    const email = uniqueEmail('ivo');
    await w.maildev.stop();

    const res = await invite(email);

    expect(res.status).toBe(201);
    const deadline = Date.now() + 10_000;
    // The attempt is counted when claimed; the error is written once the send has failed.
    while (!(await outboxRows(w.t, 'to_address = $1', [email]))[0]?.last_error) {
      if (Date.now() > deadline) throw new Error('the immediate send was not attempted');
      await new Promise((r) => setTimeout(r, 100));
    }
    const [failed] = await outboxRows(w.t, 'to_address = $1', [email]);
    expect(failed).toMatchObject({
      attempts: 1,
      sent_at: null,
      last_error: expect.stringMatching(/ECONNREFUSED/),
    });

    await w.maildev.start();
    await dispatchOutbox(w.t.sequelize, w.t.mailer, {
      now: () => new Date(Date.now() + 60_000),
    });
    await mailTo(email);
    expect((await w.maildev.list()).filter((m) => m.to[0]?.address === email)).toHaveLength(1);
  });

  it('when someone asks for a password reset, then the e-mail is an outbox message of no organization, sent at once in text and HTML', async () => {
    const { agent, csrf } = await anonymousAgent(w.t);

    const res = await agent
      .post('/api/auth/password-reset')
      .set('x-csrf-token', csrf)
      .send({ email: fx.people.rosa!.email });

    expect(res.status).toBe(202);
    const mail = await mailTo(fx.people.rosa!.email);
    const link = /http:\/\/biasproof\.test\.example\/reset-password\?token=[A-Za-z0-9_-]+/.exec(
      mail.text ?? '',
    )?.[0];
    expect(link).toBeDefined();
    expect(mail.text).toContain('Hello Rosa Fixture,');
    expect(mail.html).toContain(`href="${link}"`);
    const [row] = await outboxRows(w.t, 'to_address = $1', [fx.people.rosa!.email]);
    expect(row).toMatchObject({ org_id: null, kind: 'account.password-reset', link });
    expect(row!.sent_at).not.toBeNull();
  });
});
