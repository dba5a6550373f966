import { afterAll, describe, expect, it } from 'vitest';
import { createTestApp } from '../../test-support/test-app.ts';
import {
  anonymousAgent,
  createOrgWithMembers,
  signIn,
  systemRows,
} from '../../test-support/fixtures.ts';
import { accept, invite, newcomer } from './invitation-steps.ts';

describe('accepting an invitation', () => {
  const t = createTestApp();
  afterAll(() => t.close());

  it('when a person with an account is invited, then they join by accepting signed in, and only with the invited address', async () => {
    const fx = await createOrgWithMembers(t, { admin: ['admin'] });
    const other = await createOrgWithMembers(t, { uma: ['author'], vic: ['author'] });
    const uma = other.people.uma!;
    const { token } = await invite(t, fx, uma.email, ['approver']);

    const preview = await (await anonymousAgent(t)).agent.get(`/api/invitations/${token}`);
    expect(preview.body.accountExists).toBe(true);
    const anonymous = await accept(t, token, {});
    expect(anonymous.res.status).toBe(401);
    const asNew = await accept(t, token, newcomer);
    expect(asNew.res.status).toBe(409);
    expect(asNew.res.body.error.code).toBe('account-exists');
    const vic = await signIn(t, other.people.vic!);
    const wrong = await vic.agent
      .post(`/api/invitations/${token}/accept`)
      .set('x-csrf-token', vic.csrf)
      .send({});
    expect(wrong.status).toBe(403);
    expect(wrong.body.error.code).toBe('wrong-account');

    const signedIn = await signIn(t, uma);
    const res = await signedIn.agent
      .post(`/api/invitations/${token}/accept`)
      .set('x-csrf-token', signedIn.csrf)
      .send({});

    expect(res.status).toBe(200);
    expect(
      (res.body.memberships as { orgId: string; roles: string[] }[]).map((m) => [m.orgId, m.roles]),
    ).toEqual(
      expect.arrayContaining([
        [fx.org.id, ['approver']],
        [other.org.id, ['author']],
      ]),
    );
    expect((await signedIn.agent.get(`/api/orgs/${fx.org.id}`)).status).toBe(200);
    const [row] = await systemRows<{ accepted_by_user_id: string }>(
      t,
      'SELECT accepted_by_user_id FROM invitations WHERE org_id = $1',
      [fx.org.id],
    );
    expect(row?.accepted_by_user_id).toBe(uma.id);
  });

  it('when the token is unknown or malformed, then preview and accept answer 404', async () => {
    const { agent, csrf } = await anonymousAgent(t);
    expect((await agent.get(`/api/invitations/${'Z'.repeat(43)}`)).status).toBe(404);
    expect((await agent.get('/api/invitations/not-a-token')).status).toBe(404);
    expect(
      (
        await agent
          .post('/api/invitations/not-a-token/accept')
          .set('x-csrf-token', csrf)
          .send(newcomer)
      ).status,
    ).toBe(404);
  });
});
