import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { jsonResponse, renderApp } from '@/test/render-app.tsx';

describe('sign-in page placeholder', () => {
  beforeEach(() => {
    vi.stubGlobal(
      'fetch',
      vi.fn<typeof fetch>(() =>
        Promise.resolve(jsonResponse(200, { status: 'ok', db: 'ok', version: '0.1.0' })),
      ),
    );
  });

  it('when the e-mail is not an address, then the field shows an error and nothing is submitted', async () => {
    const user = userEvent.setup();
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
    expect(screen.queryByText(/signing in arrives/i)).toBeNull();
  });

  it('when both fields are empty, then each asks to be filled in', async () => {
    const user = userEvent.setup();
    renderApp('/sign-in');

    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText('Enter your e-mail address.')).toBeDefined();
    expect(screen.getByText('Enter your password.')).toBeDefined();
  });

  it('when the fields are valid, then the page explains that sign-in arrives with accounts', async () => {
    const user = userEvent.setup();
    renderApp('/sign-in');

    await user.type(screen.getByRole('textbox', { name: 'E-mail' }), 'ada@lab.example');
    await user.type(screen.getByLabelText('Password'), 'a password');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText(/signing in arrives with them/i)).toBeDefined();
    expect(screen.getByRole('textbox', { name: 'E-mail' }).getAttribute('aria-invalid')).toBeNull();
  });
});
