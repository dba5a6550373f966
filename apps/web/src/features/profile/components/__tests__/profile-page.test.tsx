import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { updateProfileRequestSchema, type MeResponse } from '@biasproof/shared';
import { apiError, meOf, orgs, stubApi } from '@/test/fake-api.ts';
import { renderApp } from '@/test/render-app.tsx';

describe('profile', () => {
  it('when the person renames themselves, then the header shows the new name', async () => {
    const user = userEvent.setup();
    let me: MeResponse = meOf({}, [{ ...orgs.resonant, roles: ['author'] }]);
    const api = stubApi({
      'GET /api/auth/me': () => ({ status: 200, body: me }),
      'PATCH /api/auth/me': ({ body }) => {
        me = { ...me, user: { ...me.user, ...updateProfileRequestSchema.parse(body) } };
        return { status: 200, body: me };
      },
    });
    renderApp('/profile');

    const name = await screen.findByRole('textbox', { name: 'Your name' });
    await user.clear(name);
    await user.type(name, '  Ines A. Okafor ');
    await user.click(screen.getByRole('button', { name: 'Save name' }));

    expect(await screen.findByText('Your name is saved.')).toBeDefined();
    expect(
      within(screen.getByRole('banner')).getByRole('link', { name: /Ines A\. Okafor/ }),
    ).toBeDefined();
    expect(api.requestsTo('PATCH /api/auth/me')[0]?.body).toEqual({ name: 'Ines A. Okafor' });
  });

  it('when the current password is wrong, then the server’s field message shows under it', async () => {
    const user = userEvent.setup();
    stubApi({
      'GET /api/auth/me': () => ({
        status: 200,
        body: meOf({}, [{ ...orgs.resonant, roles: ['author'] }]),
      }),
      'POST /api/auth/me/password': () =>
        apiError(400, 'invalid-input', 'Check the marked fields.', {
          currentPassword: 'This is not your current password.',
        }),
    });
    renderApp('/profile');

    await user.type(await screen.findByLabelText('Current password'), 'not-my-password');
    await user.type(screen.getByLabelText('New password'), 'common-mode-rejection');
    await user.type(screen.getByLabelText('Repeat the new password'), 'common-mode-rejection');
    await user.click(screen.getByRole('button', { name: 'Change password' }));

    const current = await screen.findByLabelText('Current password', {
      selector: 'input[aria-invalid="true"]',
    });
    expect(current.getAttribute('aria-describedby')).toBeTruthy();
    expect(screen.getByText('This is not your current password.')).toBeDefined();
  });
});
