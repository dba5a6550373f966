import { afterAll, describe, expect, it } from 'vitest';
import { createTestApp } from '../../test-support/test-app.ts';
import {
  anonymousAgent,
  createOrgWithMembers,
  systemRows,
  uniqueEmail,
} from '../../test-support/fixtures.ts';
import { hashToken } from '../../auth/tokens.ts';
import { accept, invite, newcomer, waitForTokenWithHash } from './invitation-steps.ts';

describe('invitations', () => {
  const t = createTestApp();
  afterAll(() => t.close());

  it('when an admin invites a new person, then the row keeps only the token hash, the e-mail links to the app, and accepting signs them in as a member', async () => {
    const fx = await createOrgWithMembers(t, { admin: ['admin'] });
    const email = uniqueEmail('nia');
    const { admin, invitation, token } = await invite(t, fx, email.toUpperCase(), [
      'checker',
      'author',
    ]);

    expect(invitation).toEqual({
      id: expect.any(String),
      email,
      roles: ['author', 'checker'],
      invitedBy: { id: fx.people.admin!.id, name: fx.people.admin!.name },
      createdAt: expect.any(String),
      expiresAt: expect.any(String),
      status: 'pending',
    });
    const [row] = await systemRows<{ token_hash: string; expires_at: Date }>(
      t,
      'SELECT token_hash, expires_at FROM invitations WHERE id = $1',
      [invitation.id],
    );
    expect(row?.token_hash).toBe(hashToken(token));
    const days = (new Date(row!.expires_at).getTime() - Date.now()) / 86_400_000;
    expect(days).toBeGreaterThan(6.99);
    expect(days).toBeLessThanOrEqual(7);

    const preview = await (await anonymousAgent(t)).agent.get(`/api/invitations/${token}`);
    expect(preview.status).toBe(200);
    expect(preview.body).toEqual({
      orgName: fx.org.name,
      email,
      roles: ['author', 'checker'],
      invitedByName: fx.people.admin!.name,
      accountExists: false,
      expiresAt: expect.any(String),
    });

    const { agent, res } = await accept(t, token, newcomer);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({
      user: { id: expect.any(String), email, name: newcomer.name },
      memberships: [
        {
          orgId: fx.org.id,
          orgSlug: fx.org.slug,
          orgName: fx.org.name,
          roles: ['author', 'checker'],
        },
      ],
    });
    expect((await agent.get('/api/auth/me')).body.user.email).toBe(email);
    const members = await systemRows<{ roles: string[] }>(
      t,
      'SELECT m.roles FROM memberships m JOIN users u ON u.id = m.user_id WHERE m.org_id = $1 AND u.email = $2',
      [fx.org.id, email],
    );
    expect(members).toEqual([{ roles: ['author', 'checker'] }]);
    const list = await admin.agent.get(`/api/orgs/${fx.org.id}/invitations?status=all`);
    expect((list.body.items as { status: string }[]).map((i) => i.status)).toEqual(['accepted']);
    const events = await systemRows<{ action: string }>(
      t,
      'SELECT action FROM audit_events WHERE org_id = $1 ORDER BY seq',
      [fx.org.id],
    );
    expect(events.map((e) => e.action)).toEqual([
      'organization.created',
      'member.added',
      'invitation.created',
      'invitation.accepted',
    ]);
  });

  it('when the same link is used twice, then the second answers invitation-used and no second account appears', async () => {
    const fx = await createOrgWithMembers(t, { admin: ['admin'] });
    const email = uniqueEmail('olu');
    const { token } = await invite(t, fx, email);
    expect((await accept(t, token, newcomer)).res.status).toBe(200);

    const again = await accept(t, token, { ...newcomer, name: 'Someone Else' });

    expect(again.res.status).toBe(400);
    expect(again.res.body.error.code).toBe('invitation-used');
    expect(await systemRows(t, 'SELECT id FROM users WHERE email = $1', [email])).toHaveLength(1);
    expect(
      (await (await anonymousAgent(t)).agent.get(`/api/invitations/${token}`)).body.error.code,
    ).toBe('invitation-used');
  });

  it('when the invitation is older than 7 days, then preview and accept answer invitation-expired and nothing is created', async () => {
    const fx = await createOrgWithMembers(t, { admin: ['admin'] });
    const email = uniqueEmail('pia');
    const { admin, invitation, token } = await invite(t, fx, email);
    await systemRows(
      t,
      `UPDATE invitations SET expires_at = now() - interval '1 second' WHERE id = $1 RETURNING id`,
      [invitation.id],
    );

    const preview = await (await anonymousAgent(t)).agent.get(`/api/invitations/${token}`);
    const { res } = await accept(t, token, newcomer);

    expect(preview.status).toBe(400);
    expect(preview.body.error.code).toBe('invitation-expired');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invitation-expired');
    expect(await systemRows(t, 'SELECT id FROM users WHERE email = $1', [email])).toEqual([]);
    const pending = await admin.agent.get(`/api/orgs/${fx.org.id}/invitations`);
    expect(pending.body).toEqual({ items: [], total: 0 });
    const all = await admin.agent.get(`/api/orgs/${fx.org.id}/invitations?status=all`);
    expect(all.body.items[0].status).toBe('expired');
  });

  it('when an admin revokes an invitation, then its link answers invitation-revoked and it leaves the pending list', async () => {
    const fx = await createOrgWithMembers(t, { admin: ['admin'] });
    const email = uniqueEmail('quin');
    const { admin, invitation, token } = await invite(t, fx, email);

    const res = await admin.agent
      .delete(`/api/orgs/${fx.org.id}/invitations/${invitation.id}`)
      .set('x-csrf-token', admin.csrf);

    expect(res.status).toBe(204);
    const [row] = await systemRows<{ revoked_at: Date | null }>(
      t,
      'SELECT revoked_at FROM invitations WHERE id = $1',
      [invitation.id],
    );
    expect(row?.revoked_at).not.toBeNull();
    const accepted = await accept(t, token, newcomer);
    expect(accepted.res.status).toBe(400);
    expect(accepted.res.body.error.code).toBe('invitation-revoked');
    expect(await systemRows(t, 'SELECT id FROM users WHERE email = $1', [email])).toEqual([]);
    expect((await admin.agent.get(`/api/orgs/${fx.org.id}/invitations`)).body.total).toBe(0);
    const [event] = await systemRows<{ target_id: string }>(
      t,
      `SELECT target_id FROM audit_events WHERE org_id = $1 AND action = 'invitation.revoked'`,
      [fx.org.id],
    );
    expect(event?.target_id).toBe(invitation.id);
  });

  it('when an admin resends, then a new link arrives, the old one stops working and the new one works', async () => {
    const fx = await createOrgWithMembers(t, { admin: ['admin'] });
    const email = uniqueEmail('rui');
    const { admin, invitation, token: oldToken } = await invite(t, fx, email);
    await systemRows(
      t,
      `UPDATE invitations SET expires_at = now() - interval '1 second' WHERE id = $1 RETURNING id`,
      [invitation.id],
    );

    const res = await admin.agent
      .post(`/api/orgs/${fx.org.id}/invitations/${invitation.id}/resend`)
      .set('x-csrf-token', admin.csrf);

    expect(res.status).toBe(200);
    expect(res.body.status).toBe('pending');
    const [row] = await systemRows<{ token_hash: string }>(
      t,
      'SELECT token_hash FROM invitations WHERE id = $1',
      [invitation.id],
    );
    expect(row?.token_hash).not.toBe(hashToken(oldToken));
    expect((await accept(t, oldToken, newcomer)).res.status).toBe(404);
    const newToken = await waitForTokenWithHash(email, row!.token_hash);
    expect((await accept(t, newToken, newcomer)).res.status).toBe(200);
  });

  it('when the address is already a member or already invited, then inviting again answers 409 and stores nothing', async () => {
    const fx = await createOrgWithMembers(t, { admin: ['admin'], sam: ['author'] });
    const email = uniqueEmail('tess');
    const { admin } = await invite(t, fx, email);

    const member = await admin.agent
      .post(`/api/orgs/${fx.org.id}/invitations`)
      .set('x-csrf-token', admin.csrf)
      .send({ email: fx.people.sam!.email, roles: ['checker'] });
    const twice = await admin.agent
      .post(`/api/orgs/${fx.org.id}/invitations`)
      .set('x-csrf-token', admin.csrf)
      .send({ email, roles: ['author'] });

    expect(member.status).toBe(409);
    expect(member.body.error.code).toBe('already-member');
    expect(twice.status).toBe(409);
    expect(twice.body.error.code).toBe('invitation-pending');
    expect(
      await systemRows(t, 'SELECT id FROM invitations WHERE org_id = $1', [fx.org.id]),
    ).toHaveLength(1);
  });
});
