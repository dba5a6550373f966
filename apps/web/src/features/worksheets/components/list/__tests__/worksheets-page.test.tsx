import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { createWorksheetRequestSchema, type WorksheetListItem } from '@biasproof/shared';
import {
  aListItem,
  aWorksheet,
  powerProject,
  projectIds,
  sensorProject,
  worksheetId,
} from '@/features/worksheets/components/__tests__/stored-worksheet-kit.ts';
import { list, meOf, orgs, stubApi } from '@/test/fake-api.ts';
import { renderApp } from '@/test/render-app.tsx';

vi.setConfig({ testTimeout: 20_000 });

const items: WorksheetListItem[] = [
  aListItem({ id: 'ws-1', title: 'Input clamp, channel A', state: 'draft' }),
  aListItem({
    id: 'ws-2',
    title: 'Bias of the output stage',
    state: 'in_check',
    projectId: projectIds.power,
    projectCode: 'PWR',
    projectName: 'Power stage',
    author: { id: 'user-tomas', name: 'Tomas Lindqvist' },
  }),
];

function worksheetServer() {
  return stubApi({
    'GET /api/auth/me': () => ({
      status: 200,
      body: meOf({}, [{ ...orgs.resonant, roles: ['author'] }]),
    }),
    'GET /api/orgs/org-resonant/projects': () => ({
      status: 200,
      body: list([sensorProject, powerProject]),
    }),
    'GET /api/orgs/org-resonant/worksheets': ({ query }) => {
      const shown = items.filter(
        (w) =>
          (!query.get('projectId') || w.projectId === query.get('projectId')) &&
          (!query.get('state') || w.state === query.get('state')) &&
          (!query.get('authorId') || w.author.id === query.get('authorId')) &&
          (!query.get('q') || w.title.toLowerCase().includes(query.get('q')!.toLowerCase())),
      );
      return { status: 200, body: list(shown) };
    },
    'POST /api/orgs/org-resonant/worksheets': ({ body }) => {
      const input = createWorksheetRequestSchema.parse(body);
      return {
        status: 201,
        body: aWorksheet(undefined, { title: input.title, projectId: input.projectId }),
      };
    },
    'GET /api/orgs/org-resonant/worksheets/:id': () => ({
      status: 200,
      body: aWorksheet(undefined, { title: 'Output clamp' }),
    }),
    'GET /api/orgs/org-resonant/models': () => ({ status: 200, body: list([]) }),
  });
}

/** The query of the newest list request. */
function lastListQuery(api: ReturnType<typeof worksheetServer>): URLSearchParams {
  const all = api.requestsTo('GET /api/orgs/org-resonant/worksheets');
  return all[all.length - 1]!.query;
}

describe('worksheet list', () => {
  it('when the person filters, searches and sorts, then the list asks the server for exactly that', async () => {
    const api = worksheetServer();
    const user = userEvent.setup();
    renderApp('/o/resonant-labs/worksheets');

    const table = await screen.findByRole('table', { name: /Worksheets \(2\)/ });
    const row = within(table).getByRole('row', { name: /Bias of the output stage/ });
    expect(within(row).getByText('In check')).toBeDefined();
    expect(within(row).getByText('PWR')).toBeDefined();
    expect(within(row).getByText('Tomas Lindqvist')).toBeDefined();
    expect(lastListQuery(api).toString()).toBe('sort=updatedAt&dir=desc&limit=25&offset=0');

    await user.selectOptions(screen.getByLabelText('Project'), 'PWR · Power stage');
    await waitFor(() => expect(lastListQuery(api).get('projectId')).toBe(projectIds.power));
    await user.selectOptions(screen.getByLabelText('State'), 'In check');
    await waitFor(() => expect(lastListQuery(api).get('state')).toBe('in_check'));
    await user.selectOptions(screen.getByLabelText('Author'), 'Me');
    await waitFor(() => expect(lastListQuery(api).get('authorId')).toBe('user-ines'));
    expect(await screen.findByText('No worksheet matches these filters.')).toBeDefined();
    await user.click(screen.getByRole('checkbox', { name: 'Assigned to me' }));
    await waitFor(() => expect(lastListQuery(api).get('assignedToMe')).toBe('true'));

    // Back to everything, then a search: one request once the typing pauses, not one per key.
    await user.selectOptions(screen.getByLabelText('Project'), 'All projects');
    await user.selectOptions(screen.getByLabelText('State'), 'Any state');
    await user.selectOptions(screen.getByLabelText('Author'), 'Anyone');
    await user.click(screen.getByRole('checkbox', { name: 'Assigned to me' }));
    await waitFor(() => expect(lastListQuery(api).get('assignedToMe')).toBeNull());
    const before = api.requestsTo('GET /api/orgs/org-resonant/worksheets').length;
    await user.type(screen.getByLabelText('Search title and description'), 'clamp');
    await waitFor(() => expect(lastListQuery(api).get('q')).toBe('clamp'));
    const searches = api.requestsTo('GET /api/orgs/org-resonant/worksheets').slice(before);
    expect(searches.map((r) => r.query.get('q'))).toEqual(['clamp']);
    await waitFor(() =>
      expect(screen.queryByRole('row', { name: /Bias of the output/ })).toBeNull(),
    );

    const titleHeader = screen.getByRole('columnheader', { name: /Worksheet/ });
    expect(titleHeader.getAttribute('aria-sort')).toBe('none');
    await user.click(within(titleHeader).getByRole('button'));
    await waitFor(() => expect(lastListQuery(api).get('sort')).toBe('title'));
    expect(lastListQuery(api).get('dir')).toBe('asc');
    expect(titleHeader.getAttribute('aria-sort')).toBe('ascending');
    await user.click(within(titleHeader).getByRole('button'));
    await waitFor(() => expect(lastListQuery(api).get('dir')).toBe('desc'));
    expect(titleHeader.getAttribute('aria-sort')).toBe('descending');
  });

  it('when the person filters and sorts, then "Download CSV" exports every matching row with those filters and that sort, no paging', async () => {
    worksheetServer();
    const user = userEvent.setup();
    renderApp(
      `/o/resonant-labs/worksheets?project=${projectIds.power}&state=in_check&q=output&sort=title&dir=asc&page=2`,
    );
    const csv = await screen.findByRole('link', { name: 'Download CSV' });
    expect(csv.hasAttribute('download')).toBe(true);
    const exported = () => new URL(csv.getAttribute('href') ?? '', 'http://app.example');
    expect(exported().pathname).toBe('/api/orgs/org-resonant/worksheets/export.csv');
    expect(exported().search).toBe(
      `?projectId=${projectIds.power}&state=in_check&q=output&sort=title&dir=asc`,
    );

    await user.selectOptions(screen.getByLabelText('Author'), 'Me');
    await user.click(screen.getByRole('checkbox', { name: 'Assigned to me' }));
    await waitFor(() => expect(exported().searchParams.get('assignedToMe')).toBe('true'));
    expect(exported().searchParams.get('authorId')).toBe('user-ines');
    expect(exported().searchParams.get('limit')).toBeNull();
    expect(exported().searchParams.get('offset')).toBeNull();

    await user.selectOptions(screen.getByLabelText('Project'), 'All projects');
    await user.selectOptions(screen.getByLabelText('State'), 'Any state');
    await user.selectOptions(screen.getByLabelText('Author'), 'Anyone');
    await user.click(screen.getByRole('checkbox', { name: 'Assigned to me' }));
    await user.clear(screen.getByLabelText('Search title and description'));
    await waitFor(() => expect(exported().search).toBe('?sort=title&dir=asc'));
  });

  it('when the person moves with the arrow keys, then focus goes from row link to row link', async () => {
    worksheetServer();
    const user = userEvent.setup();
    renderApp('/o/resonant-labs/worksheets');
    const first = await screen.findByRole('link', { name: 'Input clamp, channel A' });
    first.focus();
    await user.keyboard('{ArrowDown}');
    expect(document.activeElement).toBe(
      screen.getByRole('link', { name: 'Bias of the output stage' }),
    );
    await user.keyboard('{ArrowUp}');
    expect(document.activeElement).toBe(first);
    expect(first.getAttribute('href')).toBe('/o/resonant-labs/worksheets/ws-1');
  });

  it('when the author creates a worksheet, then it opens in the editor', async () => {
    const api = worksheetServer();
    const user = userEvent.setup();
    const { router } = renderApp('/o/resonant-labs/worksheets');
    await user.click(await screen.findByRole('button', { name: 'New worksheet' }));
    const form = screen.getByRole('form', { name: 'New worksheet' });
    await user.click(within(form).getByRole('button', { name: 'Create and open' }));
    expect(within(form).getByText('Choose a project.')).toBeDefined();
    expect(within(form).getByText('Enter a title.')).toBeDefined();

    await user.selectOptions(within(form).getByLabelText('Project'), 'SFE · Sensor front end');
    await user.type(within(form).getByLabelText('Title'), 'Output clamp');
    await user.click(within(form).getByRole('button', { name: 'Create and open' }));

    // The editor loads as its own chunk: allow for it on a cold start.
    expect(
      await screen.findByRole('heading', { level: 1, name: 'Output clamp' }, { timeout: 10_000 }),
    ).toBeDefined();
    expect(router.state.location.pathname).toBe(`/o/resonant-labs/worksheets/${worksheetId}`);
    expect(api.requestsTo('POST /api/orgs/org-resonant/worksheets')[0]?.body).toEqual({
      projectId: projectIds.sensor,
      title: 'Output clamp',
      description: '',
    });
  });
});
