import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { jsonResponse, renderApp } from '@/test/render-app.tsx';

describe('app shell', () => {
  beforeEach(() => {
    vi.stubGlobal(
      'fetch',
      vi.fn<typeof fetch>(() =>
        Promise.resolve(jsonResponse(200, { status: 'ok', db: 'ok', version: '0.1.0' })),
      ),
    );
  });

  it('when a visitor opens the start page, then it has one heading, the caution and a way to sign in', async () => {
    const user = userEvent.setup();
    renderApp('/');

    expect(screen.getAllByRole('heading', { level: 1 })).toHaveLength(1);
    expect(screen.getByRole('main')).toBeDefined();
    expect(screen.getByRole('contentinfo').textContent).toMatch(
      /engineering aids, not a substitute for qualified review/,
    );

    await user.click(screen.getByRole('link', { name: 'Go to sign-in' }));

    expect(await screen.findByRole('heading', { level: 1, name: 'Sign in' })).toBeDefined();
  });

  it('when the address matches no page, then the not-found page links back to the start', async () => {
    const user = userEvent.setup();
    renderApp('/no/such/page');

    expect(
      screen.getByRole('heading', { level: 1, name: 'No page at this address' }),
    ).toBeDefined();
    await user.click(screen.getByRole('link', { name: 'Back to the start page' }));

    expect(await screen.findByRole('link', { name: 'Go to sign-in' })).toBeDefined();
  });
});
