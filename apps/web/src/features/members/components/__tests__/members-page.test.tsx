import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import {
  createInvitationRequestSchema,
  updateMemberRequestSchema,
  type Invitation,
  type Member,
  type Role,
} from '@biasproof/shared';
import {
  aMember,
  anInvitation,
  apiError,
  CSRF_TOKEN,
  list,
  meOf,
  orgs,
  stubApi,
} from '@/test/fake-api.ts';
import { renderApp } from '@/test/render-app.tsx';

const membersPath = '/o/resonant-labs/members';

/** Resonant Labs with three people and one pending invitation; the caller holds `roles`. */
function resonantServer(roles: Role[]) {
  const me = meOf({}, [{ ...orgs.resonant, roles }]);
  let members: Member[] = [
    aMember({ userId: 'user-ines', name: 'Ines Okafor', roles }),
    aMember({ userId: 'user-tomas', name: 'Tomas Lindqvist', roles: ['author'] }),
    aMember({ userId: 'user-priya', name: 'Priya Raman', roles: ['admin', 'approver'] }),
  ];
  let invitations: Invitation[] = [anInvitation({ id: 'inv-1', email: 'kofi@resonant.example' })];
  const api = stubApi({
    'GET /api/auth/me': () => ({ status: 200, body: me }),
    'GET /api/orgs/org-resonant/members': () => ({ status: 200, body: list(members) }),
    'PATCH /api/orgs/org-resonant/members/:userId': ({ params, body }) => {
      const change = updateMemberRequestSchema.parse(body);
      if (change.roles && params.userId === 'user-priya' && !change.roles.includes('admin')) {
        return apiError(
          409,
          'last-admin',
          'The organization needs at least one other admin first.',
        );
      }
      members = members.map((m) => (m.userId === params.userId ? { ...m, ...change } : m));
      return { status: 200, body: members.find((m) => m.userId === params.userId) };
    },
    'DELETE /api/orgs/org-resonant/members/:userId': ({ params }) => {
      members = members.filter((m) => m.userId !== params.userId);
      return { status: 204 };
    },
    'GET /api/orgs/org-resonant/invitations': () => ({ status: 200, body: list(invitations) }),
    'POST /api/orgs/org-resonant/invitations': ({ body }) => {
      const { email, roles: invitedRoles } = createInvitationRequestSchema.parse(body);
      if (members.some((m) => m.email === email)) {
        return apiError(409, 'already-member', 'This person is already a member.', {
          email: 'Already a member of Resonant Labs.',
        });
      }
      const created = anInvitation({
        id: `inv-${invitations.length + 1}`,
        email,
        roles: invitedRoles,
      });
      invitations = [...invitations, created];
      return { status: 201, body: created };
    },
    'DELETE /api/orgs/org-resonant/invitations/:id': ({ params }) => {
      invitations = invitations.filter((i) => i.id !== params.id);
      return { status: 204 };
    },
    'POST /api/orgs/org-resonant/invitations/:id/resend': ({ params }) => ({
      status: 200,
      body: invitations.find((i) => i.id === params.id),
    }),
  });
  return api;
}

function rowOf(name: RegExp | string) {
  return screen.getByRole('rowheader', { name }).closest('tr') as HTMLElement;
}

describe('members and invitations page', () => {
  it('when a checker opens it, then the members show without any admin action and invitations stay hidden', async () => {
    const api = resonantServer(['checker']);
    renderApp(membersPath);

    expect(await screen.findByRole('rowheader', { name: /Tomas Lindqvist/ })).toBeDefined();
    expect(
      screen.getByRole('heading', { level: 1, name: 'Members and invitations' }),
    ).toBeDefined();
    expect(screen.getByRole('heading', { name: 'Members of Resonant Labs' })).toBeDefined();
    expect(screen.queryByRole('button', { name: /change roles/i })).toBeNull();
    expect(screen.queryByRole('button', { name: /remove/i })).toBeNull();
    expect(screen.queryByRole('button', { name: /disable/i })).toBeNull();
    expect(screen.queryByRole('columnheader', { name: 'Actions' })).toBeNull();
    expect(screen.queryByRole('heading', { name: 'Invite someone' })).toBeNull();
    expect(screen.queryByRole('heading', { name: 'Pending invitations' })).toBeNull();
    expect(api.requestsTo('GET /api/orgs/org-resonant/invitations')).toHaveLength(0);
  });

  it('when an admin opens it, then every other member has actions and the admin’s own row has none', async () => {
    resonantServer(['admin']);
    renderApp(membersPath);

    await screen.findByRole('rowheader', { name: /Tomas Lindqvist/ });
    expect(
      within(rowOf(/Tomas Lindqvist/)).getByRole('button', {
        name: 'Change roles of Tomas Lindqvist',
      }),
    ).toBeDefined();
    expect(
      within(rowOf(/Tomas Lindqvist/)).getByRole('button', { name: 'Remove Tomas Lindqvist' }),
    ).toBeDefined();
    expect(within(rowOf(/Ines Okafor/)).queryAllByRole('button')).toHaveLength(0);
    expect(within(rowOf(/Ines Okafor/)).getByText('(you)')).toBeDefined();
    expect(await screen.findByRole('rowheader', { name: 'kofi@resonant.example' })).toBeDefined();
  });

  it('when the invite form is sent empty or with a bad address, then it says what is missing and sends nothing', async () => {
    const user = userEvent.setup();
    const api = resonantServer(['admin']);
    renderApp(membersPath);
    const email = await screen.findByRole('textbox', { name: 'E-mail of the person to invite' });

    await user.click(screen.getByRole('button', { name: 'Send invitation' }));
    expect(await screen.findByText('Enter an e-mail address.')).toBeDefined();
    expect(screen.getByText('Choose at least one role.')).toBeDefined();

    await user.type(email, 'kwame-at-resonant');
    await user.click(screen.getByRole('checkbox', { name: 'Checker' }));
    await user.click(screen.getByRole('button', { name: 'Send invitation' }));
    expect(await screen.findByText(/Enter a valid e-mail address/)).toBeDefined();
    expect(screen.queryByText('Choose at least one role.')).toBeNull();
    expect(api.requestsTo('POST /api/orgs/org-resonant/invitations')).toHaveLength(0);
  });

  it('when an admin invites a checker, then the invitation is posted with the CSRF token and appears among the pending ones', async () => {
    const user = userEvent.setup();
    const api = resonantServer(['admin']);
    renderApp(membersPath);

    await user.type(
      await screen.findByRole('textbox', { name: 'E-mail of the person to invite' }),
      'Kwame@Resonant.example',
    );
    const checker = screen.getByRole('checkbox', {
      name: 'Checker',
      description: /Reviews submitted revisions/,
    });
    await user.click(checker);
    await user.click(screen.getByRole('button', { name: 'Send invitation' }));

    expect(await screen.findByText('Invitation sent to kwame@resonant.example.')).toBeDefined();
    const [posted] = api.requestsTo('POST /api/orgs/org-resonant/invitations');
    expect(posted?.headers['x-csrf-token']).toBe(CSRF_TOKEN);
    expect(posted?.body).toEqual({ email: 'kwame@resonant.example', roles: ['checker'] });
    expect(await screen.findByRole('rowheader', { name: 'kwame@resonant.example' })).toBeDefined();
    expect(
      screen.getByRole<HTMLInputElement>('textbox', { name: 'E-mail of the person to invite' })
        .value,
    ).toBe('');
  });

  it('when the server refuses the address, then its message shows on the e-mail field', async () => {
    const user = userEvent.setup();
    resonantServer(['admin']);
    renderApp(membersPath);

    await user.type(
      await screen.findByRole('textbox', { name: 'E-mail of the person to invite' }),
      'tomas@resonant.example',
    );
    await user.click(screen.getByRole('checkbox', { name: 'Author' }));
    await user.click(screen.getByRole('button', { name: 'Send invitation' }));

    expect(
      await screen.findByRole('textbox', {
        name: 'E-mail of the person to invite',
        description: 'Already a member of Resonant Labs.',
      }),
    ).toBeDefined();
  });

  it('when an admin changes a member’s roles inline, then the new roles are saved and shown', async () => {
    const user = userEvent.setup();
    const api = resonantServer(['admin']);
    renderApp(membersPath);

    await user.click(
      await screen.findByRole('button', { name: 'Change roles of Tomas Lindqvist' }),
    );
    const editor = within(rowOf(/Tomas Lindqvist/)).getByRole('group', {
      name: 'Roles of Tomas Lindqvist',
    });
    expect(within(editor).getByRole('checkbox', { name: 'Author' })).toHaveProperty(
      'checked',
      true,
    );
    await user.click(within(editor).getByRole('checkbox', { name: 'Checker' }));
    await user.click(screen.getByRole('button', { name: 'Save roles' }));

    expect(await screen.findByText('Roles of Tomas Lindqvist saved.')).toBeDefined();
    expect(api.requestsTo('PATCH /api/orgs/org-resonant/members/user-tomas')[0]?.body).toEqual({
      roles: ['author', 'checker'],
    });
    const chips = within(rowOf(/Tomas Lindqvist/)).getByRole('list', { name: 'Roles' });
    expect(
      within(chips)
        .getAllByRole('listitem')
        .map((li) => li.textContent),
    ).toEqual(['Author', 'Checker']);
    expect(document.activeElement).toBe(
      screen.getByRole('button', { name: 'Change roles of Tomas Lindqvist' }),
    );
  });

  it('when a change would leave no admin, then the server’s refusal is shown in the row', async () => {
    const user = userEvent.setup();
    resonantServer(['admin']);
    renderApp(membersPath);

    await user.click(await screen.findByRole('button', { name: 'Change roles of Priya Raman' }));
    const editor = screen.getByRole('group', { name: 'Roles of Priya Raman' });
    await user.click(within(editor).getByRole('checkbox', { name: 'Admin' }));
    await user.click(screen.getByRole('button', { name: 'Save roles' }));

    expect((await screen.findByRole('alert')).textContent).toBe(
      'The organization needs at least one other admin first.',
    );
    expect(screen.getByRole('group', { name: 'Roles of Priya Raman' })).toBeDefined();
  });

  it('when an admin removes a member, then a confirmation comes first and Cancel changes nothing', async () => {
    const user = userEvent.setup();
    const api = resonantServer(['admin']);
    renderApp(membersPath);

    await user.click(await screen.findByRole('button', { name: 'Remove Tomas Lindqvist' }));
    const dialog = screen.getByRole('alertdialog', {
      name: 'Remove Tomas Lindqvist from Resonant Labs?',
    });
    expect(document.activeElement).toBe(within(dialog).getByRole('button', { name: 'Cancel' }));
    await user.click(within(dialog).getByRole('button', { name: 'Cancel' }));
    expect(screen.queryByRole('alertdialog')).toBeNull();
    expect(api.requestsTo('DELETE /api/orgs/org-resonant/members/user-tomas')).toHaveLength(0);

    await user.click(screen.getByRole('button', { name: 'Remove Tomas Lindqvist' }));
    await user.click(screen.getByRole('button', { name: 'Remove member' }));

    expect(
      await screen.findByText('Tomas Lindqvist was removed from Resonant Labs.'),
    ).toBeDefined();
    expect(screen.queryByRole('rowheader', { name: /Tomas Lindqvist/ })).toBeNull();
    expect(
      api.requestsTo('DELETE /api/orgs/org-resonant/members/user-tomas')[0]?.headers[
        'x-csrf-token'
      ],
    ).toBe(CSRF_TOKEN);
  });

  it('when an admin disables and then enables a member, then the status follows', async () => {
    const user = userEvent.setup();
    const api = resonantServer(['admin']);
    renderApp(membersPath);

    await user.click(await screen.findByRole('button', { name: 'Disable Tomas Lindqvist' }));
    await user.click(
      within(screen.getByRole('alertdialog')).getByRole('button', { name: 'Disable' }),
    );

    expect(await within(rowOf(/Tomas Lindqvist/)).findByText('Disabled')).toBeDefined();
    await user.click(screen.getByRole('button', { name: 'Enable Tomas Lindqvist' }));
    expect(await within(rowOf(/Tomas Lindqvist/)).findByText('Active')).toBeDefined();
    expect(
      api.requestsTo('PATCH /api/orgs/org-resonant/members/user-tomas').map((r) => r.body),
    ).toEqual([{ disabled: true }, { disabled: false }]);
  });

  it('when an admin resends and then revokes an invitation, then each is confirmed on the page', async () => {
    const user = userEvent.setup();
    const api = resonantServer(['admin']);
    renderApp(membersPath);

    await user.click(
      await screen.findByRole('button', { name: 'Resend the invitation to kofi@resonant.example' }),
    );
    expect(
      await screen.findByText('A new invitation link went to kofi@resonant.example.'),
    ).toBeDefined();
    expect(api.requestsTo('POST /api/orgs/org-resonant/invitations/inv-1/resend')).toHaveLength(1);

    await user.click(
      screen.getByRole('button', { name: 'Revoke the invitation to kofi@resonant.example' }),
    );
    await user.click(screen.getByRole('button', { name: 'Revoke invitation' }));

    expect(await screen.findByText('No invitation is waiting for an answer.')).toBeDefined();
    expect(api.requestsTo('DELETE /api/orgs/org-resonant/invitations/inv-1')).toHaveLength(1);
  });
});
