import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { apiError, aMember, list, meOf, orgs, stubApi } from '@/test/fake-api.ts';
import { renderApp } from '@/test/render-app.tsx';

const ines = meOf({}, [{ ...orgs.resonant, roles: ['admin'] }]);

describe('session', () => {
  it('when the session ends while a page loads (401), then the person signs in and comes back to that page', async () => {
    const user = userEvent.setup();
    let sessionAlive = true;
    stubApi({
      'GET /api/auth/me': () =>
        sessionAlive
          ? { status: 200, body: ines }
          : apiError(401, 'unauthenticated', 'Sign in first.'),
      'GET /api/orgs/:orgId/members': () => {
        if (!sessionAlive) return apiError(401, 'unauthenticated', 'Sign in first.');
        return { status: 200, body: list([aMember({ userId: 'user-ines', name: 'Ines Okafor' })]) };
      },
      'GET /api/orgs/:orgId/invitations': () => ({ status: 200, body: list([]) }),
      'POST /api/auth/sign-in': () => {
        sessionAlive = true;
        return { status: 200, body: ines };
      },
    });
    const { router } = renderApp('/o/resonant-labs');
    expect(await screen.findByRole('heading', { level: 1, name: 'My queue' })).toBeDefined();

    sessionAlive = false; // idle timeout on the server
    await user.click(within(screen.getByRole('banner')).getByRole('link', { name: 'Members' }));

    expect(await screen.findByRole('heading', { level: 1, name: 'Sign in' })).toBeDefined();
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(new URLSearchParams(router.state.location.search).get('next')).toBe(
      '/o/resonant-labs/members',
    );
    expect(within(screen.getByRole('banner')).getByRole('link', { name: 'Sign in' })).toBeDefined();

    await user.type(screen.getByRole('textbox', { name: 'E-mail' }), 'ines@resonant.example');
    await user.type(screen.getByLabelText('Password'), 'tunnel-diode-bias');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(
      await screen.findByRole('heading', { level: 1, name: 'Members and invitations' }),
    ).toBeDefined();
    expect(router.state.location.pathname).toBe('/o/resonant-labs/members');
    expect(await screen.findByRole('rowheader', { name: /Ines Okafor/ })).toBeDefined();
  });

  it('when a signed-out visitor opens an organization page, then sign-in asks first and remembers the page', async () => {
    stubApi({});
    const { router } = renderApp('/o/resonant-labs/members');

    expect(await screen.findByRole('heading', { level: 1, name: 'Sign in' })).toBeDefined();
    expect(router.state.location.search).toBe(
      `?next=${encodeURIComponent('/o/resonant-labs/members')}`,
    );
    expect(screen.getByText('Sign in to continue where you were.')).toBeDefined();
  });

  it('when the address names an organization the person is not in, then it reads as an unknown page', async () => {
    stubApi({ 'GET /api/auth/me': () => ({ status: 200, body: ines }) });
    renderApp('/o/someone-elses-org/members');

    expect(
      await screen.findByRole('heading', { level: 1, name: 'No page at this address' }),
    ).toBeDefined();
  });

  it('when the person signs out, then the header offers sign-in and organization pages need a session again', async () => {
    const user = userEvent.setup();
    let signedIn = true;
    const api = stubApi({
      'GET /api/auth/me': () =>
        signedIn ? { status: 200, body: ines } : apiError(401, 'unauthenticated', 'Sign in first.'),
      'GET /api/orgs/org-resonant/members': () => ({ status: 200, body: list([]) }),
      'GET /api/orgs/org-resonant/invitations': () => ({ status: 200, body: list([]) }),
      'POST /api/auth/sign-out': () => {
        signedIn = false;
        return { status: 204 };
      },
    });
    const { router } = renderApp('/o/resonant-labs/members');
    await screen.findByRole('heading', { level: 1, name: 'Members and invitations' });

    await user.click(screen.getByRole('button', { name: 'Sign out' }));

    expect(await screen.findByRole('heading', { level: 1, name: 'Sign in' })).toBeDefined();
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(router.state.location.search).toBe('');
    expect(api.requestsTo('POST /api/auth/sign-out')).toHaveLength(1);
    expect(
      within(screen.getByRole('banner')).queryByRole('button', { name: 'Sign out' }),
    ).toBeNull();
  });
});
