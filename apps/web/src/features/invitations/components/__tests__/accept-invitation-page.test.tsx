import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { acceptInvitationNewAccountSchema, type MeResponse } from '@biasproof/shared';
import { apiError, CSRF_TOKEN, list, meOf, orgs, stubApi } from '@/test/fake-api.ts';
import { renderApp } from '@/test/render-app.tsx';

const token = 'tok-7f3a9c1e5b2d4f6a8c0e';
const invitePath = `/invitations/${token}`;

function preview(accountExists: boolean) {
  return {
    orgName: 'Resonant Labs',
    email: 'kwame@resonant.example',
    roles: ['checker'],
    invitedByName: 'Ines Okafor',
    accountExists,
    expiresAt: '2026-05-08T09:00:00.000Z',
  };
}

describe('accepting an invitation', () => {
  it('when a new person sets a name and password, then they join, are signed in and land on the organization’s queue', async () => {
    const user = userEvent.setup();
    let me: MeResponse | null = null;
    const api = stubApi({
      'GET /api/auth/me': () =>
        me ? { status: 200, body: me } : apiError(401, 'unauthenticated', 'Sign in first.'),
      'GET /api/invitations/:token': () => ({ status: 200, body: preview(false) }),
      'POST /api/invitations/:token/accept': ({ body }) => {
        const { name } = acceptInvitationNewAccountSchema.parse(body);
        me = meOf({ id: 'user-kwame', email: 'kwame@resonant.example', name }, [
          { ...orgs.resonant, roles: ['checker'] },
        ]);
        return { status: 200, body: me };
      },
      'GET /api/orgs/org-resonant/members': () => ({ status: 200, body: list([]) }),
    });
    const { router } = renderApp(invitePath);

    expect(
      await screen.findByRole('heading', { level: 1, name: 'Join Resonant Labs' }),
    ).toBeDefined();
    expect(screen.getByText(/Ines Okafor invited/)).toBeDefined();
    expect(screen.getByText('Checker')).toBeDefined();
    expect(screen.getByText(/Reviews submitted revisions/)).toBeDefined();

    await user.type(screen.getByRole('textbox', { name: 'Your name' }), 'Kwame Mensah');
    await user.type(screen.getByLabelText('Password'), 'short');
    await user.type(screen.getByLabelText('Repeat the password'), 'different');
    await user.click(screen.getByRole('button', { name: 'Create account and join' }));
    expect(await screen.findByText('Use at least 12 characters.')).toBeDefined();
    expect(screen.getByText(/The two passwords differ/)).toBeDefined();
    expect(api.requestsTo(`POST /api/invitations/${token}/accept`)).toHaveLength(0);

    await user.clear(screen.getByLabelText('Password'));
    await user.type(screen.getByLabelText('Password'), 'gain-bandwidth-product');
    await user.clear(screen.getByLabelText('Repeat the password'));
    await user.type(screen.getByLabelText('Repeat the password'), 'gain-bandwidth-product');
    await user.click(screen.getByRole('button', { name: 'Create account and join' }));

    expect(await screen.findByRole('heading', { level: 1, name: 'My queue' })).toBeDefined();
    expect(router.state.location.pathname).toBe('/o/resonant-labs');
    expect(
      within(screen.getByRole('banner')).getByRole('link', { name: /Kwame Mensah/ }),
    ).toBeDefined();
    const [accepted] = api.requestsTo(`POST /api/invitations/${token}/accept`);
    expect(accepted?.headers['x-csrf-token']).toBe(CSRF_TOKEN);
    expect(accepted?.body).toEqual({ name: 'Kwame Mensah', password: 'gain-bandwidth-product' });
  });

  it('when the invitation has expired, then the server’s explanation shows and no form', async () => {
    stubApi({
      'GET /api/invitations/:token': () =>
        apiError(400, 'invitation-expired', 'This invitation expired. Ask for a new one.'),
    });
    renderApp(invitePath);

    expect((await screen.findByRole('alert')).textContent).toBe(
      'This invitation expired. Ask for a new one.',
    );
    expect(screen.queryByRole('button', { name: /join/i })).toBeNull();
  });

  it('when the address already has an account and nobody is signed in, then the page asks to sign in and come back', async () => {
    stubApi({ 'GET /api/invitations/:token': () => ({ status: 200, body: preview(true) }) });
    renderApp(invitePath);

    const link = await screen.findByRole('link', { name: 'Sign in to accept' });
    expect(link.getAttribute('href')).toBe(`/sign-in?next=${encodeURIComponent(invitePath)}`);
    expect(screen.queryByLabelText('Password')).toBeNull();
  });

  it('when the invited person is signed in, then one button joins with an empty body', async () => {
    const user = userEvent.setup();
    const before = meOf(
      { id: 'user-kwame', email: 'kwame@resonant.example', name: 'Kwame Mensah' },
      [{ ...orgs.quartz, roles: ['author'] }],
    );
    let me = before;
    const api = stubApi({
      'GET /api/auth/me': () => ({ status: 200, body: me }),
      'GET /api/invitations/:token': () => ({ status: 200, body: preview(true) }),
      'POST /api/invitations/:token/accept': () => {
        me = {
          ...before,
          memberships: [...before.memberships, { ...orgs.resonant, roles: ['checker'] }],
        };
        return { status: 200, body: me };
      },
    });
    const { router } = renderApp(invitePath);

    await user.click(await screen.findByRole('button', { name: 'Join Resonant Labs' }));

    expect(await screen.findByRole('heading', { level: 1, name: 'My queue' })).toBeDefined();
    expect(router.state.location.pathname).toBe('/o/resonant-labs');
    expect(api.requestsTo(`POST /api/invitations/${token}/accept`)[0]?.body).toEqual({});
  });

  it('when someone else is signed in, then the page says whose invitation it is', async () => {
    stubApi({
      'GET /api/auth/me': () => ({
        status: 200,
        body: meOf({}, [{ ...orgs.resonant, roles: ['admin'] }]),
      }),
      'GET /api/invitations/:token': () => ({ status: 200, body: preview(true) }),
    });
    renderApp(invitePath);

    expect((await screen.findByRole('alert')).textContent).toMatch(
      /signed in as ines@resonant\.example, but this invitation is for kwame@resonant\.example/,
    );
  });
});
