import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import type { QueueResponse, Role, WorksheetListItem } from '@biasproof/shared';
import { apiError, meOf, orgs, stubApi } from '@/test/fake-api.ts';
import { renderApp } from '@/test/render-app.tsx';

vi.setConfig({ testTimeout: 20_000 });
const ines = { id: 'user-ines', name: 'Ines Okafor' };
const tomas = { id: 'user-tomas', name: 'Tomas Lindqvist' };
const priya = { id: 'user-priya', name: 'Priya Raman' };

function aWorksheet(id: string, title: string, extra: Partial<WorksheetListItem> = {}) {
  return {
    id,
    title,
    description: '',
    state: 'in_check',
    projectId: 'project-sfe',
    projectName: 'Sensor front end',
    projectCode: 'SFE',
    revision: 'A',
    version: 4,
    author: tomas,
    checker: ines,
    approver: priya,
    resultStatus: 'solved',
    createdAt: '2026-11-20T09:00:00.000Z',
    updatedAt: '2026-11-30T09:00:00.000Z',
    ...extra,
  } satisfies WorksheetListItem;
}

const emptyQueue: QueueResponse = { toCheck: [], toSign: [], returnedToMe: [], recentlySigned: [] };

function queueServer(roles: Role[], queue: () => QueueResponse | Promise<QueueResponse>) {
  return stubApi({
    'GET /api/auth/me': () => ({ status: 200, body: meOf({}, [{ ...orgs.resonant, roles }]) }),
    'GET /api/orgs/org-resonant/queue': async () => ({ status: 200, body: await queue() }),
    'GET /api/orgs/org-resonant/worksheets/:id': () =>
      apiError(404, 'not-found', 'No such worksheet.'),
  });
}

function section(name: string) {
  return screen.getByRole('region', { name });
}

describe('my queue', () => {
  it('when work waits, then each list shows its count and worksheets, and a worksheet opens from its link', async () => {
    queueServer(['author', 'checker'], () => ({
      ...emptyQueue,
      toCheck: [
        aWorksheet('ws-1', 'Input clamp, channel A'),
        aWorksheet('ws-2', 'Bandgap startup', { revision: 'C' }),
      ],
      returnedToMe: [
        aWorksheet('ws-3', 'LED driver', { state: 'returned', author: ines, checker: tomas }),
      ],
    }));
    const user = userEvent.setup();
    const { router } = renderApp('/o/resonant-labs');

    expect(await screen.findByText(/3 worksheets wait for you\./)).toBeDefined();
    const toCheck = section('To check');
    expect(within(toCheck).getByTestId('to-check-count').textContent).toBe('2 worksheets');
    expect(
      within(toCheck).getByRole('link', { name: 'Bandgap startup' }).closest('li')?.textContent,
    ).toMatch(/SFE · revision C · by Tomas Lindqvist · updated/);
    expect(
      within(section('Returned to me')).getByRole('link', { name: 'LED driver' }),
    ).toBeDefined();
    expect(within(section('Returned to me')).getByText(/checker Tomas Lindqvist/)).toBeDefined();
    expect(within(section('To sign')).getByText('Nothing to sign')).toBeDefined();
    expect(within(section('Recently signed')).getByText('Nothing signed lately')).toBeDefined();
    expect(screen.queryByRole('heading', { name: 'Nothing waits for you right now' })).toBeNull();

    await user.click(within(toCheck).getByRole('link', { name: 'Input clamp, channel A' }));
    // The worksheet page's code loads first.
    await waitFor(
      () => expect(router.state.location.pathname).toBe('/o/resonant-labs/worksheets/ws-1'),
      { timeout: 10_000 },
    );
  });

  it('when the queue is still loading, then each list says so; when it is empty, then the role hints and each list’s empty text show', async () => {
    let answer = (_: QueueResponse) => undefined as void;
    queueServer(['checker', 'approver'], () => new Promise<QueueResponse>((r) => (answer = r)));
    renderApp('/o/resonant-labs');

    expect(await screen.findByRole('status', { name: 'Loading “To check”…' })).toBeDefined();
    expect(screen.getByRole('status', { name: 'Loading “Recently signed”…' })).toBeDefined();
    answer(emptyQueue);

    const empty = await screen.findByRole('region', { name: 'Nothing waits for you right now' });
    expect(
      within(empty)
        .getAllByRole('listitem')
        .map((li) => li.textContent),
    ).toEqual(['revisions submitted for your check', 'checked revisions awaiting your signature']);
    expect(within(section('To check')).getByText('Nothing to check')).toBeDefined();
    expect(
      within(section('To sign')).getByText(
        'Checked revisions with you as their approver land here.',
      ),
    ).toBeDefined();
    expect(within(section('To check')).getByTestId('to-check-count').textContent).toBe(
      '0 worksheets',
    );
  });

  it('when the queue cannot be loaded, then the person is told and may try again', async () => {
    let fail = true;
    stubApi({
      'GET /api/auth/me': () => ({
        status: 200,
        body: meOf({}, [{ ...orgs.resonant, roles: ['author'] }]),
      }),
      'GET /api/orgs/org-resonant/queue': () =>
        fail
          ? apiError(500, 'internal', 'The server hiccuped.')
          : { status: 200, body: emptyQueue },
    });
    const user = userEvent.setup();
    renderApp('/o/resonant-labs');
    expect((await screen.findByRole('alert')).textContent).toBe(
      'Your queue could not be loaded: The server hiccuped.',
    );
    fail = false;
    await user.click(screen.getByRole('button', { name: 'Try again' }));
    expect(await screen.findByText('Nothing to check')).toBeDefined();
  });
});
