import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { listResponseSchema, projectSchema } from '@biasproof/shared';
import { createTestApp } from '../../test-support/test-app.ts';
import { systemRows } from '../../test-support/fixtures.ts';
import { absentId, orgSnapshot } from '../../test-support/org-routes.ts';
import {
  auditEvents,
  createTeam,
  expectShape,
  newProject,
  newWorksheet,
  pluck,
  type Team,
} from '../../test-support/team.ts';

describe('projects', () => {
  const t = createTestApp();
  let team: Team;
  beforeAll(async () => {
    team = await createTeam(t);
  });
  afterAll(() => t.close());

  it('when an author creates a project, then it answers 201 with the project, stores it with an upper-case code and audits it', async () => {
    const res = await team.as.ann.post('/projects', {
      name: '  Tidewater front end ',
      code: 'twh-1',
      description: 'Hydrophone preamp',
    });

    expect(res.status).toBe(201);
    expectShape(projectSchema, res.body);
    expect(res.body).toMatchObject({
      name: 'Tidewater front end',
      code: 'TWH-1',
      description: 'Hydrophone preamp',
      archived: false,
      worksheetCount: 0,
    });
    const [row] = await systemRows(
      t,
      'SELECT org_id, code, created_by_user_id FROM projects WHERE id = $1',
      [res.body.id],
    );
    expect(row).toEqual({
      org_id: team.org.id,
      code: 'TWH-1',
      created_by_user_id: team.people.ann!.id,
    });
    const [event] = (await auditEvents(t, team.org.id, 'project.created')).filter(
      (e) => e.target_id === res.body.id,
    );
    expect(event).toMatchObject({
      actor_user_id: team.people.ann!.id,
      details: { name: 'Tidewater front end', code: 'TWH-1' },
    });
  });

  it('when a project code is already used in the organization, regardless of case, then it answers 409 naming the field and stores nothing', async () => {
    await newProject(team.as.ann, { code: 'DUP-1' });
    const before = await orgSnapshot(t, team.org.id);

    const res = await team.as.bob.post('/projects', { name: 'Other', code: 'dup-1' });

    expect(res.status).toBe(409);
    expect(res.body.error).toMatchObject({
      code: 'conflict',
      fields: { code: expect.stringContaining('DUP-1') },
    });
    expect(await orgSnapshot(t, team.org.id)).toEqual(before);
  });

  it('when a project is created with bad fields, then it answers 400 with a message per field and stores nothing', async () => {
    const before = await orgSnapshot(t, team.org.id);

    const res = await team.as.ann.post('/projects', {
      name: ' ',
      code: 'no spaces',
      description: 'x'.repeat(4001),
    });

    expect(res.status).toBe(400);
    expect(res.body.error).toEqual({
      code: 'validation-failed',
      message: 'Some fields are not valid',
      fields: {
        name: 'Enter a project name.',
        code: 'Use letters, digits, - _ and . only, starting with a letter or digit.',
        description: 'A description has at most 4000 characters.',
      },
    });
    expect(await orgSnapshot(t, team.org.id)).toEqual(before);
  });

  it('when a project is renamed, re-coded and archived, then the answer and the row show it, and each request writes one audit event', async () => {
    const project = await newProject(team.as.ann, { name: 'Old name', code: 'REN-1' });

    const renamed = await team.as.bob.patch(`/projects/${project.id}`, {
      name: 'New name',
      code: 'ren-2',
    });
    const archived = await team.as.max.patch(`/projects/${project.id}`, { archived: true });
    const again = await team.as.max.patch(`/projects/${project.id}`, { archived: true });

    expect(renamed.status).toBe(200);
    expect(renamed.body).toMatchObject({ name: 'New name', code: 'REN-2', archived: false });
    expect(archived.body).toMatchObject({ name: 'New name', archived: true });
    expect(again.status).toBe(200);
    const events = await systemRows<{ action: string; details: unknown }>(
      t,
      `SELECT action, details FROM audit_events WHERE org_id = $1 AND target_id = $2 ORDER BY seq`,
      [team.org.id, project.id],
    );
    expect(events).toEqual([
      { action: 'project.created', details: { name: 'Old name', code: 'REN-1' } },
      {
        action: 'project.updated',
        details: {
          before: { name: 'Old name', code: 'REN-1' },
          after: { name: 'New name', code: 'REN-2' },
        },
      },
      {
        action: 'project.archived',
        details: { before: { archived: false }, after: { archived: true } },
      },
    ]);
  });

  it('when a project is archived, then it takes no new worksheets until it is restored', async () => {
    const project = await newProject(team.as.ann, { code: 'ARC-1' });
    await team.as.ann.patch(`/projects/${project.id}`, { archived: true }).expect(200);

    const refused = await team.as.ann.post('/worksheets', { projectId: project.id, title: 'Late' });
    await team.as.ann.patch(`/projects/${project.id}`, { archived: false }).expect(200);
    const accepted = await team.as.ann.post('/worksheets', {
      projectId: project.id,
      title: 'Late',
    });

    expect(refused.status).toBe(400);
    expect(refused.body.error.fields).toEqual({
      projectId: 'This project is archived; restore it before adding worksheets.',
    });
    expect(accepted.status).toBe(201);
  });

  it('when projects are listed, then archived ones are hidden unless asked for, search matches name, code or description, and pages hold the total', async () => {
    const team2 = await createTeam(t);
    const api = team2.as.ann;
    const a = await newProject(api, { name: 'Alpha sensor', code: 'ALP' });
    const b = await newProject(api, {
      name: 'Bravo supply',
      code: 'BRV',
      description: 'low-dropout 100% tested',
    });
    const c = await newProject(api, { name: 'Charlie clock', code: 'CHR' });
    await newWorksheet(api, a.id);
    await api.patch(`/projects/${c.id}`, { archived: true }).expect(200);

    const active = await api.get('/projects');
    const archived = await api.get('/projects?archived=true');
    const all = await api.get('/projects?archived=all&limit=2&offset=1');
    const byCode = await api.get('/projects?q=brv');
    const byDescription = await api.get('/projects?q=%25');
    const bad = await api.get('/projects?archived=maybe&limit=0');

    expectShape(listResponseSchema(projectSchema), active.body);
    expect(pluck(active.body, 'code')).toEqual(['ALP', 'BRV']);
    expect(active.body.items[0].worksheetCount).toBe(1);
    expect(archived.body).toMatchObject({ total: 1, items: [{ id: c.id, archived: true }] });
    expect(all.body.total).toBe(3);
    expect(pluck(all.body, 'id')).toEqual([b.id, c.id]);
    expect(pluck(byCode.body, 'id')).toEqual([b.id]);
    expect(pluck(byDescription.body, 'id')).toEqual([b.id]);
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toEqual({
      archived: 'Use true, false or all.',
      limit: 'Use 1 to 100.',
    });
  });

  it('when another organization’s project or an absent id is read or changed, then it answers 404 and nothing changes', async () => {
    const other = await createTeam(t);
    const foreign = await newProject(other.as.ann, { code: 'FOR-1' });
    const before = await orgSnapshot(t, other.org.id);

    const read = await team.as.ann.get(`/projects/${foreign.id}`);
    const patch = await team.as.ann.patch(`/projects/${foreign.id}`, { archived: true });
    const absent = await team.as.ann.get(`/projects/${absentId()}`);
    const worksheet = await team.as.ann.post('/worksheets', {
      projectId: foreign.id,
      title: 'Sneaky',
    });

    for (const res of [read, patch, absent, worksheet]) {
      expect(res.status).toBe(404);
      expect(res.body.error.code).toBe('not-found');
    }
    expect(await orgSnapshot(t, other.org.id)).toEqual(before);
  });

  it('when a checker or an approver tries to create or change a project, then it answers 403', async () => {
    const project = await newProject(team.as.ann, { code: 'ROLE-1' });
    const create = await team.as.kim.post('/projects', { name: 'Nope', code: 'NOPE' });
    const patch = await team.as.abe.patch(`/projects/${project.id}`, { name: 'Nope' });
    expect([create.status, patch.status]).toEqual([403, 403]);
  });
});
