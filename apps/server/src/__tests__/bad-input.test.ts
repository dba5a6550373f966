import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp } from '../test-support/test-app.ts';
import {
  anonymousAgent,
  signIn,
  systemRows,
  type SignedInAgent,
} from '../test-support/fixtures.ts';
import { createOrgWorld, orgSnapshot, type OrgWorld } from '../test-support/org-routes.ts';
import { newLinkToken } from '../auth/tokens.ts';

interface BadCall {
  name: string;
  method: 'get' | 'post' | 'patch';
  path: (w: OrgWorld) => string;
  body?: unknown;
  /** field path → message, exactly as answered */
  fields: Record<string, string>;
  signedIn: boolean;
}

const badCalls: BadCall[] = [
  {
    name: 'sign-in with empty fields',
    method: 'post',
    path: () => '/api/auth/sign-in',
    body: { email: ' ', password: '' },
    fields: { email: 'Enter your e-mail address.', password: 'Enter your password.' },
    signedIn: false,
  },
  {
    name: 'sign-in with a malformed e-mail and no password',
    method: 'post',
    path: () => '/api/auth/sign-in',
    body: { email: 'ada-at-nowhere' },
    fields: {
      email: 'Enter a valid e-mail address, like name@company.example.',
      password: expect.any(String),
    },
    signedIn: false,
  },
  {
    name: 'profile with an empty name',
    method: 'patch',
    path: () => '/api/auth/me',
    body: { name: '   ' },
    fields: { name: 'Enter a name.' },
    signedIn: true,
  },
  {
    name: 'password change with a short new password',
    method: 'post',
    path: () => '/api/auth/me/password',
    body: { currentPassword: '', newPassword: 'short' },
    fields: {
      currentPassword: 'Enter your current password.',
      newPassword: 'Use at least 12 characters.',
    },
    signedIn: true,
  },
  {
    name: 'reset request with a malformed e-mail',
    method: 'post',
    path: () => '/api/auth/password-reset',
    body: { email: 'not an address' },
    fields: { email: 'Enter a valid e-mail address, like name@company.example.' },
    signedIn: false,
  },
  {
    name: 'reset confirmation with a short token and a common password',
    method: 'post',
    path: () => '/api/auth/password-reset/confirm',
    body: { token: 'abc', password: 'qwerty123456' },
    fields: {
      token: 'This reset link is not valid.',
      password: 'This password is too common; choose another.',
    },
    signedIn: false,
  },
  {
    name: 'invitation acceptance with an empty name and a short password',
    method: 'post',
    path: () => `/api/invitations/${newLinkToken().token}/accept`,
    body: { name: '', password: 'short' },
    fields: { name: 'Enter a name.', password: 'Use at least 12 characters.' },
    signedIn: false,
  },
  {
    name: 'member update with no roles',
    method: 'patch',
    path: (w) => `/api/orgs/${w.org.id}/members/${w.targetUserId}`,
    body: { roles: [] },
    fields: { roles: 'Choose at least one role.' },
    signedIn: true,
  },
  {
    name: 'member update with an unknown role and a non-boolean flag',
    method: 'patch',
    path: (w) => `/api/orgs/${w.org.id}/members/${w.targetUserId}`,
    body: { roles: ['boss'], disabled: 'yes' },
    fields: { 'roles.0': expect.any(String), disabled: expect.any(String) },
    signedIn: true,
  },
  {
    name: 'member update with nothing to change',
    method: 'patch',
    path: (w) => `/api/orgs/${w.org.id}/members/${w.targetUserId}`,
    body: {},
    fields: { _: 'Nothing to change.' },
    signedIn: true,
  },
  {
    name: 'invitation with a bad e-mail and no roles',
    method: 'post',
    path: (w) => `/api/orgs/${w.org.id}/invitations`,
    body: { email: 'nobody', roles: [] },
    fields: {
      email: 'Enter a valid e-mail address, like name@company.example.',
      roles: 'Choose at least one role.',
    },
    signedIn: true,
  },
  {
    name: 'invitation list with an unknown status',
    method: 'get',
    path: (w) => `/api/orgs/${w.org.id}/invitations?status=maybe`,
    fields: { status: 'Use pending or all.' },
    signedIn: true,
  },
  {
    name: 'audit list with bad filters',
    method: 'get',
    path: (w) => `/api/orgs/${w.org.id}/audit?limit=0&offset=-1&actor=someone&from=yesterday`,
    fields: {
      limit: 'Use 1 to 500.',
      offset: 'Use 0 or more.',
      actor: 'Choose a person from the list.',
      from: 'Use a date like 2026-12-01 or a date-time like 2026-12-01T09:30:00Z.',
    },
    signedIn: true,
  },
];

describe('bad input on every route', () => {
  const t = createTestApp();
  let world: OrgWorld;
  let admin: SignedInAgent;
  beforeAll(async () => {
    world = await createOrgWorld(t, ['admin', 'manager']);
    admin = await signIn(t, world.people.actor!);
  });
  afterAll(() => t.close());

  it.each(badCalls.map((c) => [c.name, c] as const))(
    'when %s arrives, then it answers 400 with field messages and nothing changes',
    async (_name, c) => {
      const { agent, csrf } = c.signedIn ? admin : await anonymousAgent(t);
      const before = await orgSnapshot(t, world.org.id);
      const accounts = await systemRows(t, 'SELECT count(*) AS n FROM users');
      const resets = await systemRows(t, 'SELECT count(*) AS n FROM password_resets');

      const req = agent[c.method](c.path(world)).set('x-csrf-token', csrf);
      const res = c.body === undefined ? await req : await req.send(c.body as object);

      expect(res.status).toBe(400);
      expect(res.body).toEqual({
        error: {
          code: 'validation-failed',
          message: 'Some fields are not valid',
          fields: c.fields,
        },
      });
      expect(await orgSnapshot(t, world.org.id)).toEqual(before);
      expect(await systemRows(t, 'SELECT count(*) AS n FROM users')).toEqual(accounts);
      expect(await systemRows(t, 'SELECT count(*) AS n FROM password_resets')).toEqual(resets);
    },
  );

  it('when a body is not JSON, then it answers 400 bad-request', async () => {
    const res = await admin.agent
      .patch(`/api/orgs/${world.org.id}/members/${world.targetUserId}`)
      .set('x-csrf-token', admin.csrf)
      .set('content-type', 'application/json')
      .send('{"roles": [');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad-request');
  });
});
