import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { notificationPreferencesSchema, type NotificationPreferences } from '@biasproof/shared';
import { apiError, meOf, orgs, stubApi } from '@/test/fake-api.ts';
import { renderApp } from '@/test/render-app.tsx';

function preferencesServer(start: NotificationPreferences) {
  let stored = start;
  return stubApi({
    'GET /api/auth/me': () => ({
      status: 200,
      body: meOf({}, [{ ...orgs.resonant, roles: ['checker'] }]),
    }),
    'GET /api/account/notifications': () => ({ status: 200, body: stored }),
    'PUT /api/account/notifications': ({ body }) => {
      const parsed = notificationPreferencesSchema.safeParse(body);
      if (!parsed.success) return apiError(400, 'validation-failed', 'Bad preferences.');
      stored = parsed.data;
      return { status: 200, body: stored };
    },
  });
}

describe('e-mail notification preferences', () => {
  it('when the person switches to a daily digest at 06:00 UTC, then it is stored and said, and the hour only applies to the digest', async () => {
    const api = preferencesServer({ delivery: 'immediate', digestHourUtc: 7 });
    const user = userEvent.setup();
    renderApp('/profile');

    const form = await screen.findByRole('form', { name: 'E-mail notifications' });
    const immediately = within(form).getByRole('radio', { name: /Immediately/ });
    expect((immediately as HTMLInputElement).checked).toBe(true);
    const hour = within(form).getByLabelText<HTMLSelectElement>('Hour of the digest');
    expect(hour.disabled).toBe(true);
    expect(
      within(form).getByRole('button', { name: 'Save e-mail settings' }).matches(':disabled'),
    ).toBe(true);

    await user.click(within(form).getByRole('radio', { name: /Daily digest/ }));
    expect(hour.disabled).toBe(false);
    await user.selectOptions(hour, '6');
    expect(hour.selectedOptions[0]?.text).toMatch(/^06:00 UTC \(\d\d:00 here\)$/);
    await user.click(within(form).getByRole('button', { name: 'Save e-mail settings' }));

    expect((await within(form).findByRole('status')).textContent).toMatch(
      /^Saved: one digest a day at 06:00 UTC/,
    );
    expect(api.requestsTo('PUT /api/account/notifications')[0]?.body).toEqual({
      delivery: 'daily-digest',
      digestHourUtc: 6,
    });
  });

  it('when the preferences cannot be loaded, then the profile says so and the rest still works', async () => {
    stubApi({
      'GET /api/auth/me': () => ({
        status: 200,
        body: meOf({}, [{ ...orgs.resonant, roles: ['author'] }]),
      }),
      'GET /api/account/notifications': () => apiError(500, 'internal', 'The server hiccuped.'),
    });
    renderApp('/profile');
    expect((await screen.findByRole('alert')).textContent).toBe(
      'Your e-mail settings could not be loaded: The server hiccuped.',
    );
    expect(screen.getByRole('textbox', { name: 'Your name' })).toBeDefined();
  });
});
