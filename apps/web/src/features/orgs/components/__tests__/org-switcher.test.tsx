import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { aMember, list, meOf, orgs, stubApi } from '@/test/fake-api.ts';
import { renderApp } from '@/test/render-app.tsx';

describe('organization switcher', () => {
  it('when the person switches organization, then the same page shows the other organization’s list', async () => {
    const user = userEvent.setup();
    stubApi({
      'GET /api/auth/me': () => ({
        status: 200,
        body: meOf({}, [
          { ...orgs.resonant, roles: ['admin'] },
          { ...orgs.quartz, roles: ['checker'] },
        ]),
      }),
      'GET /api/orgs/org-resonant/members': () => ({
        status: 200,
        body: list([aMember({ userId: 'u1', name: 'Tomas Lindqvist' })]),
      }),
      'GET /api/orgs/org-resonant/invitations': () => ({ status: 200, body: list([]) }),
      'GET /api/orgs/org-quartz/members': () => ({
        status: 200,
        body: list([aMember({ userId: 'u2', name: 'Mirela Stan' })]),
      }),
    });
    const { router } = renderApp('/o/resonant-labs/members');
    expect(await screen.findByRole('rowheader', { name: /Tomas Lindqvist/ })).toBeDefined();

    const switcher = screen.getByRole('button', { name: 'Organization: Resonant Labs' });
    await user.click(switcher);
    const menu = screen.getByRole('list', { name: 'Your organizations' });
    expect(document.activeElement).toBe(within(menu).getByRole('link', { name: 'Resonant Labs' }));
    await user.keyboard('{ArrowDown}');
    expect(document.activeElement).toBe(within(menu).getByRole('link', { name: 'Quartz Works' }));
    await user.keyboard('{Enter}');

    expect(await screen.findByRole('rowheader', { name: /Mirela Stan/ })).toBeDefined();
    expect(router.state.location.pathname).toBe('/o/quartz-works/members');
    expect(screen.queryByRole('rowheader', { name: /Tomas Lindqvist/ })).toBeNull();
    expect(screen.getByRole('button', { name: 'Organization: Quartz Works' })).toBeDefined();
    expect(screen.queryByRole('heading', { name: 'Invite someone' })).toBeNull();
  });
});
