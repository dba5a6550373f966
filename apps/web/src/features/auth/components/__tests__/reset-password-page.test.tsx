import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { apiError, stubApi } from '@/test/fake-api.ts';
import { renderApp } from '@/test/render-app.tsx';

const token = 'reset-0123456789abcdefghij';

describe('reset password', () => {
  it('when the new password is set twice alike, then the token and password are sent and the page says so', async () => {
    const user = userEvent.setup();
    const api = stubApi({ 'POST /api/auth/password-reset/confirm': () => ({ status: 204 }) });
    renderApp(`/reset-password?token=${token}`);

    await user.type(screen.getByLabelText('New password'), 'quiescent-point-42');
    await user.type(screen.getByLabelText('Repeat the new password'), 'quiescent-point-42');
    await user.click(screen.getByRole('button', { name: 'Set new password' }));

    expect(
      await screen.findByRole('heading', { level: 1, name: 'Password changed' }),
    ).toBeDefined();
    expect(api.requestsTo('POST /api/auth/password-reset/confirm')[0]?.body).toEqual({
      token,
      password: 'quiescent-point-42',
    });
    expect(screen.getByRole('link', { name: 'Sign in with your new password' })).toBeDefined();
  });

  it('when the link was used already, then the server’s message shows with a way to ask for a new one', async () => {
    const user = userEvent.setup();
    stubApi({
      'POST /api/auth/password-reset/confirm': () =>
        apiError(400, 'reset-used', 'This reset link was used already.'),
    });
    renderApp(`/reset-password?token=${token}`);

    await user.type(screen.getByLabelText('New password'), 'quiescent-point-42');
    await user.type(screen.getByLabelText('Repeat the new password'), 'quiescent-point-42');
    await user.click(screen.getByRole('button', { name: 'Set new password' }));

    expect((await screen.findByRole('alert')).textContent).toMatch(
      /This reset link was used already\./,
    );
    expect(screen.getByRole('link', { name: 'Ask for a new link' })).toBeDefined();
  });

  it('when the link has no token, then the page explains instead of showing a form', () => {
    stubApi({});
    renderApp('/reset-password');

    expect(screen.getByRole('alert').textContent).toMatch(/not complete/);
    expect(screen.queryByLabelText('New password')).toBeNull();
  });
});
