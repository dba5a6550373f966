import { expect } from 'vitest';
import type { TestApp } from '../../test-support/test-app.ts';
import { anonymousAgent, signIn, type OrgFixture } from '../../test-support/fixtures.ts';
import { waitForEmail, waitForEmailWhere } from '../../test-support/maildev.ts';
import { hashToken } from '../../auth/tokens.ts';

// Steps the invitation tests share: invite through the API, read the link from maildev, accept.

export const linkToken = (text: string | undefined) =>
  /http:\/\/biasproof\.test\.example\/invitations\/([A-Za-z0-9_-]{43})/.exec(text ?? '')?.[1];

/** An admin invites `email`; returns the admin's agent, the invitation body and the e-mailed token. */
export async function invite(t: TestApp, fx: OrgFixture, email: string, roles = ['checker']) {
  const admin = await signIn(t, fx.people.admin!);
  const res = await admin.agent
    .post(`/api/orgs/${fx.org.id}/invitations`)
    .set('x-csrf-token', admin.csrf)
    .send({ email, roles });
  expect(res.status).toBe(201);
  const mail = await waitForEmail(email, new RegExp(`invited you to ${fx.org.name}`));
  const token = linkToken(mail.text);
  expect(token).toBeDefined();
  return { admin, invitation: res.body as { id: string }, token: token! };
}

export async function accept(t: TestApp, token: string, body: object) {
  const { agent, csrf } = await anonymousAgent(t);
  const res = await agent
    .post(`/api/invitations/${token}/accept`)
    .set('x-csrf-token', csrf)
    .send(body);
  return { agent, res };
}

export const newcomer = { name: 'Nia Newcomer', password: 'quiescent-point-8812' };

/** Waits for the e-mail whose link token hashes to `tokenHash` (after a resend, the newest link). */
export async function waitForTokenWithHash(email: string, tokenHash: string): Promise<string> {
  const mail = await waitForEmailWhere(email, (m) => {
    const token = linkToken(m.text);
    return Boolean(token && hashToken(token) === tokenHash);
  });
  return linkToken(mail.text)!;
}
