import { afterAll, describe, expect, it } from 'vitest';
import type { z } from 'zod';
import {
  auditEventSchema,
  auditVerifyResponseSchema,
  csrfResponseSchema,
  invitationPreviewSchema,
  invitationSchema,
  listResponseSchema,
  memberSchema,
  meResponseSchema,
  organizationSchema,
} from '@biasproof/shared';
import { createTestApp } from '../test-support/test-app.ts';
import { anonymousAgent, createOrgWithMembers, uniqueEmail } from '../test-support/fixtures.ts';
import { waitForEmail } from '../test-support/maildev.ts';

/** The body is exactly what the shared schema describes: it parses, and parsing drops nothing. */
function expectShape(schema: z.ZodType, body: unknown): void {
  const parsed = schema.safeParse(body);
  expect(parsed.error).toBeUndefined();
  expect(parsed.data).toEqual(body);
}

describe('answers follow the shared schemas (docs/api.md)', () => {
  const t = createTestApp();
  afterAll(() => t.close());

  it('when every route of accounts, members, invitations and audit answers, then each body matches its schema exactly', async () => {
    const { org, people } = await createOrgWithMembers(t, {
      boss: ['admin', 'manager'],
      ann: ['author'],
    });
    const { agent, csrf: anonymousCsrf } = await anonymousAgent(t);
    expectShape(csrfResponseSchema, (await agent.get('/api/auth/csrf')).body);

    const signedIn = await agent
      .post('/api/auth/sign-in')
      .set('x-csrf-token', anonymousCsrf)
      .send({ email: people.boss!.email, password: people.boss!.password });
    expectShape(meResponseSchema, signedIn.body);
    const csrf = signedIn.headers['x-csrf-token'] as string;
    expectShape(meResponseSchema, (await agent.get('/api/auth/me')).body);
    expectShape(
      meResponseSchema,
      (await agent.patch('/api/auth/me').set('x-csrf-token', csrf).send({ name: 'Boss Two' })).body,
    );

    const base = `/api/orgs/${org.id}`;
    expectShape(organizationSchema, (await agent.get(base)).body);
    expectShape(listResponseSchema(memberSchema), (await agent.get(`${base}/members`)).body);
    expectShape(
      memberSchema,
      (
        await agent
          .patch(`${base}/members/${people.ann!.id}`)
          .set('x-csrf-token', csrf)
          .send({ roles: ['author', 'checker'] })
      ).body,
    );

    const email = uniqueEmail('shape');
    const created = await agent
      .post(`${base}/invitations`)
      .set('x-csrf-token', csrf)
      .send({ email, roles: ['approver'] });
    expectShape(invitationSchema, created.body);
    expectShape(
      listResponseSchema(invitationSchema),
      (await agent.get(`${base}/invitations?status=all`)).body,
    );
    // Resending replaces the link, so it is tried on a second invitation; the first one is accepted below.
    const second = await agent
      .post(`${base}/invitations`)
      .set('x-csrf-token', csrf)
      .send({ email: uniqueEmail('resent'), roles: ['checker'] });
    const resent = await agent
      .post(`${base}/invitations/${second.body.id}/resend`)
      .set('x-csrf-token', csrf);
    expectShape(invitationSchema, resent.body);

    expectShape(listResponseSchema(auditEventSchema), (await agent.get(`${base}/audit`)).body);
    expectShape(auditVerifyResponseSchema, (await agent.get(`${base}/audit/verify`)).body);

    const mail = await waitForEmail(email, /invited you/);
    const token = /invitations\/([A-Za-z0-9_-]{43})/.exec(mail.text ?? '')![1]!;
    const invitee = await anonymousAgent(t);
    expectShape(
      invitationPreviewSchema,
      (await invitee.agent.get(`/api/invitations/${token}`)).body,
    );
    const accepted = await invitee.agent
      .post(`/api/invitations/${token}/accept`)
      .set('x-csrf-token', invitee.csrf)
      .send({ name: 'Shape Newcomer', password: 'quiescent-point-8812' });
    expectShape(meResponseSchema, accepted.body);
  });
});
