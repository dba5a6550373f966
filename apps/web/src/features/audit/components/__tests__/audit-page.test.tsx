import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import type { AuditEvent, Role } from '@biasproof/shared';
import { aMember, list, meOf, orgs, stubApi } from '@/test/fake-api.ts';
import { renderApp } from '@/test/render-app.tsx';

vi.setConfig({ testTimeout: 20_000 });

const tomasId = '3f1b5a80-0c1d-4e2f-9a3b-4c5d6e7f8091';
const worksheetId = '5e0c7a1d-2b3c-4d5e-8f90-a1b2c3d4e5f6';
const projectId = '0b7e1c52-6d0f-4c4e-9a53-5f2b7d8e1a01';

function anEvent(n: number, extra: Partial<AuditEvent> = {}): AuditEvent {
  return {
    id: `ev-${n}`,
    at: '2026-12-01T13:05:00.000Z',
    actor: { id: tomasId, name: 'Tomas Lindqvist' },
    action: 'worksheet.accepted',
    targetType: 'worksheet',
    targetId: worksheetId,
    revision: 'B',
    summary: `Accepted "Input clamp, channel A" revision B (${n})`,
    projectId,
    worksheetId,
    ip: '192.0.2.10',
    userAgent: 'Chromium',
    details: {},
    ...extra,
  };
}

function auditServer(roles: Role[], chain = { ok: true, events: 120 } as object) {
  return stubApi({
    'GET /api/auth/me': () => ({ status: 200, body: meOf({}, [{ ...orgs.resonant, roles }]) }),
    'GET /api/orgs/org-resonant': () => ({
      status: 200,
      body: {
        id: 'org-resonant',
        slug: 'resonant-labs',
        name: 'Resonant Labs',
        timezone: 'Europe/Berlin',
      },
    }),
    'GET /api/orgs/org-resonant/members': () => ({
      status: 200,
      body: list([aMember({ userId: tomasId, name: 'Tomas Lindqvist', roles: ['checker'] })]),
    }),
    'GET /api/orgs/org-resonant/projects': () => ({
      status: 200,
      body: list([
        {
          id: projectId,
          name: 'Sensor front end',
          code: 'SFE',
          description: '',
          archived: false,
          worksheetCount: 1,
          createdAt: '2026-04-01T09:00:00.000Z',
          updatedAt: '2026-04-01T09:00:00.000Z',
        },
      ]),
    }),
    'GET /api/orgs/org-resonant/worksheets': () => ({ status: 200, body: list([]) }),
    'GET /api/orgs/org-resonant/audit': ({ query }) => {
      const offset = Number(query.get('offset') ?? 0);
      const items = Array.from({ length: offset === 0 ? 50 : 10 }, (_, i) =>
        anEvent(offset + i + 1),
      );
      items[1] = anEvent(2, {
        action: 'worksheet.signed',
        summary: 'Signed off "Input clamp, channel A" revision B as "Reviewed"',
        details: {
          printedName: 'Priya Raman',
          meaning: 'Reviewed',
          signedAt: '2026-12-01T13:20:00.000Z',
          contentHash: 'b2'.repeat(32),
        },
      });
      return { status: 200, body: { items, total: 60 } };
    },
    'GET /api/orgs/org-resonant/audit/verify': () => ({ status: 200, body: chain }),
  });
}

describe('the audit log', () => {
  it('when a manager filters the log, then the filters go into the address and the query, the export link carries them, and pages follow', async () => {
    const api = auditServer(['manager']);
    const user = userEvent.setup();
    const { router } = renderApp('/o/resonant-labs');
    await user.click(
      within(await screen.findByRole('navigation', { name: 'Organization' })).getByRole('link', {
        name: 'Audit',
      }),
    );

    expect(
      await screen.findByRole(
        'status',
        { name: 'Audit chain: intact, 120 events' },
        { timeout: 10_000 },
      ),
    ).toBeDefined();
    const table = await screen.findByRole('table', { name: 'Audit events' });
    const row = within(table).getByRole('row', { name: /\(1\)/ });
    expect(row.textContent).toContain('2026-12-01 14:05 Europe/Berlin (GMT+01:00)');
    expect(row.textContent).toContain('Tomas Lindqvist');
    expect(
      within(row).getByRole('link', { name: 'Open worksheet (rev. B)' }).getAttribute('href'),
    ).toBe(`/o/resonant-labs/worksheets/${worksheetId}`);

    const signed = within(table).getByRole('row', { name: /Signed off/ });
    expect(within(signed).getByTestId('signature-manifest').textContent).toBe(
      `Signature: Priya Raman · Reviewed · 2026-12-01 14:20 Europe/Berlin (GMT+01:00) · SHA-256 ${'b2'.repeat(32)}`,
    );

    const filters = screen.getByRole('form', { name: 'Filter the audit log' });
    await user.type(within(filters).getByLabelText('From (date)'), '2026-11-01');
    await user.type(within(filters).getByLabelText('To (date, inclusive)'), '2026-10-01');
    await user.click(within(filters).getByRole('button', { name: 'Apply filters' }));
    expect(await within(filters).findByText('The end comes before the start.')).toBeDefined();

    await user.clear(within(filters).getByLabelText('To (date, inclusive)'));
    await user.type(within(filters).getByLabelText('To (date, inclusive)'), '2026-12-31');
    await user.selectOptions(await within(filters).findByLabelText('Person'), 'Tomas Lindqvist');
    await user.type(within(filters).getByLabelText('Action'), 'worksheet.signed');
    await user.selectOptions(within(filters).getByLabelText('Project'), 'SFE · Sensor front end');
    await user.click(within(filters).getByRole('button', { name: 'Apply filters' }));

    const wanted = `from=2026-11-01&to=2026-12-31&actor=${tomasId}&action=worksheet.signed&project=${projectId}`;
    await waitFor(() => expect(router.state.location.search).toBe(`?${wanted}`));
    await waitFor(() =>
      expect(api.requestsTo('GET /api/orgs/org-resonant/audit').at(-1)?.query.toString()).toBe(
        `${wanted}&limit=50&offset=0`,
      ),
    );
    expect(
      screen.getByRole('link', { name: 'Export these events as CSV' }).getAttribute('href'),
    ).toBe(`/api/orgs/org-resonant/audit/export.csv?${wanted}`);

    await user.click(screen.getByRole('button', { name: 'Next page' }));
    await waitFor(() => expect(router.state.location.search).toBe(`?${wanted}&page=2`));
    expect(await screen.findByText('Showing 51–60 of 60')).toBeDefined();
    expect(api.requestsTo('GET /api/orgs/org-resonant/audit').at(-1)?.query.get('offset')).toBe(
      '50',
    );
  });

  it('when the chain is broken, then the badge names the first bad event', async () => {
    auditServer(['manager'], { ok: false, events: 120, firstBadEventId: 'ev-77' });
    renderApp('/o/resonant-labs/audit');
    expect(
      (
        await screen.findByRole(
          'status',
          { name: 'Audit chain: broken at event ev-77' },
          { timeout: 10_000 },
        )
      ).textContent,
    ).toBe('Chain broken at event ev-77');
  });

  it('when an admin reads the log, then there is no chain check and no export', async () => {
    const api = auditServer(['admin']);
    renderApp('/o/resonant-labs/audit');
    expect(
      await screen.findByRole('table', { name: 'Audit events' }, { timeout: 10_000 }),
    ).toBeDefined();
    expect(screen.queryByRole('link', { name: 'Export these events as CSV' })).toBeNull();
    expect(screen.queryByRole('status', { name: /Audit chain/ })).toBeNull();
    expect(api.requestsTo('GET /api/orgs/org-resonant/audit/verify')).toHaveLength(0);
  });

  it('when an author opens the organization, then the navigation has no audit link and the page says who reads it', async () => {
    const api = auditServer(['author']);
    renderApp('/o/resonant-labs/audit');
    expect(
      await screen.findByText(
        'Managers and admins read the audit log of Resonant Labs.',
        {},
        { timeout: 10_000 },
      ),
    ).toBeDefined();
    const nav = screen.getByRole('navigation', { name: 'Organization' });
    expect(within(nav).queryByRole('link', { name: 'Audit' })).toBeNull();
    expect(within(nav).getByRole('link', { name: 'My queue' })).toBeDefined();
    expect(api.requestsTo('GET /api/orgs/org-resonant/audit')).toHaveLength(0);
  });
});
