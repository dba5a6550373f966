import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { signInRequestSchema } from '@biasproof/shared';
import { apiError, CSRF_TOKEN, list, meOf, orgs, stubApi } from '@/test/fake-api.ts';
import { renderApp } from '@/test/render-app.tsx';

const ines = meOf({}, [
  { ...orgs.resonant, roles: ['admin', 'author'] },
  { ...orgs.quartz, roles: ['checker'] },
]);

/** A server that knows one person, ines@resonant.example with the password below. */
function signInServer() {
  let signedIn = false;
  return stubApi({
    'GET /api/auth/me': () =>
      signedIn ? { status: 200, body: ines } : apiError(401, 'unauthenticated', 'Sign in first.'),
    'POST /api/auth/sign-in': ({ body }) => {
      const { email, password } = signInRequestSchema.parse(body);
      if (email !== ines.user.email || password !== 'tunnel-diode-bias') {
        return apiError(
          401,
          'invalid-credentials',
          'That e-mail and password do not match an account.',
        );
      }
      signedIn = true;
      return { status: 200, body: ines };
    },
    'GET /api/orgs/:orgId/members': () => ({ status: 200, body: list([]) }),
  });
}

describe('sign-in', () => {
  it('when the e-mail is not an address, then the field shows an error and nothing is sent', async () => {
    const user = userEvent.setup();
    const api = signInServer();
    renderApp('/sign-in');

    expect(screen.getByRole('heading', { level: 1, name: 'Sign in' })).toBeDefined();
    await user.type(screen.getByRole('textbox', { name: 'E-mail' }), 'not-an-address');
    await user.type(screen.getByLabelText('Password'), 'a password');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    const email = await screen.findByRole('textbox', {
      name: 'E-mail',
      description: /valid e-mail address/i,
    });
    expect(email.getAttribute('aria-invalid')).toBe('true');
    expect(screen.getByLabelText('Password').getAttribute('aria-invalid')).toBeNull();
    expect(api.requestsTo('POST /api/auth/sign-in')).toHaveLength(0);
  });

  it('when both fields are empty, then each asks to be filled in', async () => {
    const user = userEvent.setup();
    signInServer();
    renderApp('/sign-in');

    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText('Enter your e-mail address.')).toBeDefined();
    expect(screen.getByText('Enter your password.')).toBeDefined();
  });

  it('when the password is right, then the person lands on the first organization’s queue, signed in', async () => {
    const user = userEvent.setup();
    const api = signInServer();
    const { router } = renderApp('/sign-in');

    await user.type(screen.getByRole('textbox', { name: 'E-mail' }), 'ines@resonant.example');
    await user.type(screen.getByLabelText('Password'), 'tunnel-diode-bias');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByRole('heading', { level: 1, name: 'My queue' })).toBeDefined();
    expect(router.state.location.pathname).toBe('/o/resonant-labs');
    expect(screen.getAllByText('Resonant Labs').length).toBeGreaterThan(0);
    const banner = screen.getByRole('banner');
    expect(within(banner).getByRole('button', { name: 'Sign out' })).toBeDefined();
    expect(within(banner).getByRole('link', { name: /Ines Okafor/ })).toBeDefined();
    const [signIn] = api.requestsTo('POST /api/auth/sign-in');
    expect(signIn?.headers['x-csrf-token']).toBe(CSRF_TOKEN);
    expect(signIn?.body).toEqual({ email: 'ines@resonant.example', password: 'tunnel-diode-bias' });
  });

  it('when the password is wrong, then the server’s message shows, the password is cleared and the form can be sent again', async () => {
    const user = userEvent.setup();
    signInServer();
    const { router } = renderApp('/sign-in');

    await user.type(screen.getByRole('textbox', { name: 'E-mail' }), 'ines@resonant.example');
    await user.type(screen.getByLabelText('Password'), 'wrong-guess-here');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect((await screen.findByRole('alert')).textContent).toBe(
      'That e-mail and password do not match an account.',
    );
    expect(screen.getByLabelText<HTMLInputElement>('Password').value).toBe('');
    expect(screen.getByRole('button', { name: 'Sign in' }).hasAttribute('disabled')).toBe(false);
    expect(router.state.location.pathname).toBe('/sign-in');
  });

  it('while the sign-in is under way, then the button is disabled', async () => {
    const user = userEvent.setup();
    stubApi({ 'POST /api/auth/sign-in': () => new Promise(() => {}) });
    renderApp('/sign-in');

    await user.type(screen.getByRole('textbox', { name: 'E-mail' }), 'ines@resonant.example');
    await user.type(screen.getByLabelText('Password'), 'tunnel-diode-bias');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    const busy = await screen.findByRole('button', { name: 'Signing in…' });
    expect(busy.hasAttribute('disabled')).toBe(true);
  });

  it('when the person forgot the password, then the reset request confirms without saying whether the address exists', async () => {
    const user = userEvent.setup();
    const api = stubApi({ 'POST /api/auth/password-reset': () => ({ status: 202 }) });
    renderApp('/sign-in');

    await user.click(screen.getByRole('link', { name: 'Forgot your password?' }));
    await user.type(
      await screen.findByRole('textbox', { name: 'E-mail' }),
      'Nobody@Resonant.example',
    );
    await user.click(screen.getByRole('button', { name: 'Send reset link' }));

    expect(await screen.findByText(/If an account uses this address/)).toBeDefined();
    expect(screen.getByRole('heading', { level: 1, name: 'Check your e-mail' })).toBeDefined();
    expect(api.requestsTo('POST /api/auth/password-reset')[0]?.body).toEqual({
      email: 'nobody@resonant.example',
    });
  });
});
