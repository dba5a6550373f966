import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import {
  createProjectRequestSchema,
  updateProjectRequestSchema,
  type Project,
  type Role,
} from '@biasproof/shared';
import { apiError, CSRF_TOKEN, list, meOf, orgs, stubApi } from '@/test/fake-api.ts';
import { renderApp } from '@/test/render-app.tsx';

const projectsPath = '/o/resonant-labs/projects';

function aProject(overrides: Partial<Project> & Pick<Project, 'id' | 'name' | 'code'>): Project {
  return {
    description: '',
    archived: false,
    worksheetCount: 0,
    createdAt: '2026-04-01T09:00:00.000Z',
    updatedAt: '2026-04-01T09:00:00.000Z',
    ...overrides,
  };
}

/** Resonant Labs' projects as a tiny server; the caller holds `roles`. */
function projectServer(roles: Role[], initial: Project[]) {
  let projects = initial;
  const api = stubApi({
    'GET /api/auth/me': () => ({
      status: 200,
      body: meOf({}, [{ ...orgs.resonant, roles }]),
    }),
    'GET /api/orgs/org-resonant/projects': ({ query }) => {
      const archived = query.get('archived') ?? 'false';
      const shown = projects.filter((p) => archived === 'all' || String(p.archived) === archived);
      return { status: 200, body: list(shown) };
    },
    'POST /api/orgs/org-resonant/projects': ({ body }) => {
      const input = createProjectRequestSchema.parse(body);
      if (projects.some((p) => p.code === input.code)) {
        return apiError(409, 'conflict', 'That code is taken.', {
          code: 'Another project uses this code.',
        });
      }
      const created = aProject({ id: `p-${projects.length + 1}`, ...input });
      projects = [...projects, created];
      return { status: 201, body: created };
    },
    'PATCH /api/orgs/org-resonant/projects/:id': ({ params, body }) => {
      const change = updateProjectRequestSchema.parse(body);
      projects = projects.map((p) => (p.id === params.id ? { ...p, ...change } : p));
      return { status: 200, body: projects.find((p) => p.id === params.id) };
    },
  });
  return api;
}

describe('projects page', () => {
  it('when there are no projects, then it says what to do next; a created project appears as a row', async () => {
    const api = projectServer(['author'], []);
    const user = userEvent.setup();
    renderApp(projectsPath);

    expect(await screen.findByText('No active projects yet.')).toBeDefined();
    expect(screen.getByText(/Create the first one with the form below/)).toBeDefined();

    const form = screen.getByRole('form', { name: 'New project' });
    await user.click(within(form).getByRole('button', { name: 'Create project' }));
    expect(within(form).getByText('Enter a project name.')).toBeDefined();
    expect(within(form).getByText('Enter a project code.')).toBeDefined();
    expect(api.requestsTo('POST /api/orgs/org-resonant/projects')).toHaveLength(0);

    await user.type(within(form).getByLabelText('Project name'), 'Sensor front end');
    await user.type(within(form).getByLabelText('Code'), 'sfe-1');
    await user.type(within(form).getByLabelText('Description'), 'Bridge amplifier and clamps');
    await user.click(within(form).getByRole('button', { name: 'Create project' }));

    expect(await screen.findByText('Project Sensor front end (SFE-1) created.')).toBeDefined();
    const [request] = api.requestsTo('POST /api/orgs/org-resonant/projects');
    expect(request?.headers['x-csrf-token']).toBe(CSRF_TOKEN);
    expect(request?.body).toEqual({
      name: 'Sensor front end',
      code: 'SFE-1',
      description: 'Bridge amplifier and clamps',
    });
    const table = await screen.findByRole('table', { name: /Projects of Resonant Labs/ });
    const row = within(table).getByRole('row', { name: /Sensor front end/ });
    expect(within(row).getByText('SFE-1')).toBeDefined();
    expect(within(row).getByRole('link', { name: 'Sensor front end' }).getAttribute('href')).toBe(
      '/o/resonant-labs/projects/p-1',
    );
  });

  it('when the server rejects the code, then its message shows on the field', async () => {
    projectServer(['author'], [aProject({ id: 'p-1', name: 'Power stage', code: 'PWR' })]);
    const user = userEvent.setup();
    renderApp(projectsPath);
    const form = await screen.findByRole('form', { name: 'New project' });
    await user.type(within(form).getByLabelText('Project name'), 'Power, again');
    await user.type(within(form).getByLabelText('Code'), 'pwr');
    await user.click(within(form).getByRole('button', { name: 'Create project' }));
    expect(await within(form).findByText('Another project uses this code.')).toBeDefined();
    expect(within(form).getByLabelText('Code').getAttribute('aria-invalid')).toBe('true');
  });

  it('when an author archives a project, then it leaves the active list and can be restored', async () => {
    const api = projectServer(
      ['author'],
      [aProject({ id: 'p-1', name: 'Power stage', code: 'PWR', worksheetCount: 3 })],
    );
    const user = userEvent.setup();
    renderApp(projectsPath);
    const row = await screen.findByRole('row', { name: /Power stage/ });
    expect(within(row).getByText('3')).toBeDefined();
    await user.click(within(row).getByRole('button', { name: 'Archive Power stage' }));
    expect(await screen.findByText(/Power stage is archived/)).toBeDefined();
    expect(api.requestsTo('PATCH /api/orgs/org-resonant/projects/p-1')[0]?.body).toEqual({
      archived: true,
    });
    await waitFor(() => expect(screen.queryByRole('row', { name: /Power stage/ })).toBeNull());

    await user.selectOptions(screen.getByLabelText('Show'), 'Archived projects');
    const archived = await screen.findByRole('row', { name: /Power stage/ });
    expect(within(archived).getByText('archived')).toBeDefined();
    await user.click(within(archived).getByRole('button', { name: 'Restore Power stage' }));
    expect(await screen.findByText('Power stage is active again.')).toBeDefined();
  });

  it('when a checker opens the page, then there is no form and no archive button', async () => {
    projectServer(['checker'], [aProject({ id: 'p-1', name: 'Power stage', code: 'PWR' })]);
    renderApp(projectsPath);
    const row = await screen.findByRole('row', { name: /Power stage/ });
    expect(within(row).queryByRole('button')).toBeNull();
    expect(screen.queryByRole('form', { name: 'New project' })).toBeNull();
  });
});
