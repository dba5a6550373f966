import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { listResponseSchema, modelLibraryEntrySchema } from '@biasproof/shared';
import { createTestApp } from '../../test-support/test-app.ts';
import { systemRows } from '../../test-support/fixtures.ts';
import { orgSnapshot } from '../../test-support/org-routes.ts';
import { auditEvents, createTeam, expectShape, pluck, type Team } from '../../test-support/team.ts';

const npn = {
  name: 'QLN9',
  kind: 'NPN',
  params: { IS: 1.2e-14, BF: 220, VAF: 90 },
  ratings: { power: 0.5, current: 0.2, voltage: 40 },
  notes: 'Example values',
};

describe('model library', () => {
  const t = createTestApp();
  let team: Team;
  beforeAll(async () => {
    team = await createTeam(t);
  });
  afterAll(() => t.close());

  it('when an author adds, reads, changes and deletes a model, then each answer shows it, the row follows, and each change is audited', async () => {
    const created = await team.as.ann.post('/models', npn);
    const id = created.body.id as string;
    const read = await team.as.kim.get(`/models/${id}`);
    const changed = await team.as.bob.patch(`/models/${id}`, {
      params: { IS: 2e-14, BF: 180 },
      notes: 'Refit',
    });
    const unchanged = await team.as.bob.patch(`/models/${id}`, { notes: 'Refit' });
    const deleted = await team.as.ann.delete(`/models/${id}`);
    const gone = await team.as.ann.get(`/models/${id}`);

    expect(created.status).toBe(201);
    expectShape(modelLibraryEntrySchema, created.body);
    expect(created.body).toMatchObject(npn);
    expect(read.body).toEqual(created.body);
    expect(changed.body).toMatchObject({
      params: { IS: 2e-14, BF: 180 },
      notes: 'Refit',
      ratings: npn.ratings,
    });
    expect(unchanged.status).toBe(200);
    expect([deleted.status, gone.status]).toEqual([204, 404]);
    expect(await systemRows(t, 'SELECT id FROM model_library_entries WHERE id = $1', [id])).toEqual(
      [],
    );
    const actions = await systemRows<{ action: string; actor_user_id: string }>(
      t,
      'SELECT action, actor_user_id FROM audit_events WHERE org_id = $1 AND target_id = $2 ORDER BY seq',
      [team.org.id, id],
    );
    expect(actions).toEqual([
      { action: 'model.created', actor_user_id: team.people.ann!.id },
      { action: 'model.updated', actor_user_id: team.people.bob!.id },
      { action: 'model.deleted', actor_user_id: team.people.ann!.id },
    ]);
    const [update] = (await auditEvents(t, team.org.id, 'model.updated')).filter(
      (e) => e.target_id === id,
    );
    expect(update?.details).toEqual({
      name: 'QLN9',
      before: { params: npn.params, notes: 'Example values' },
      after: { params: { IS: 2e-14, BF: 180 }, notes: 'Refit' },
    });
  });

  it('when a name is taken regardless of case, then it answers 409 naming the field and stores nothing', async () => {
    await team.as.ann.post('/models', { ...npn, name: 'DUPQ' }).expect(201);
    const other = await team.as.ann.post('/models', { ...npn, name: 'OTHERQ' });
    const before = await orgSnapshot(t, team.org.id);

    const create = await team.as.bob.post('/models', { ...npn, name: 'dupq' });
    const rename = await team.as.bob.patch(`/models/${other.body.id}`, { name: 'DupQ' });

    for (const res of [create, rename]) {
      expect(res.status).toBe(409);
      expect(res.body.error.fields).toEqual({ name: expect.stringContaining('names ignore case') });
    }
    expect(await orgSnapshot(t, team.org.id)).toEqual(before);
  });

  it('when a model breaks the engine’s model rules, then it answers 400 with a message per field and stores nothing', async () => {
    const before = await orgSnapshot(t, team.org.id);

    const res = await team.as.ann.post('/models', {
      name: '9bad',
      kind: 'JFET',
      params: { is: 1e-14, BF: 'lots' },
      ratings: { power: -1 },
    });

    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({
      name: 'model name must start with a letter',
      kind: expect.any(String),
      'params.is': 'Use the SPICE parameter name in upper case, like IS or BF.',
      'params.BF': 'Enter a number.',
      'ratings.power': 'A rating is greater than 0 W.',
    });
    expect(await orgSnapshot(t, team.org.id)).toEqual(before);
  });

  it('when the library is listed, then models come by name, filtered by kind or text, a page at a time', async () => {
    const lib = (await createTeam(t)).as;
    for (const [name, kind] of [
      ['zeta', 'D'],
      ['Alpha', 'NPN'],
      ['beta', 'NPN'],
      ['Gamma', 'NMOS'],
    ] as const) {
      await lib.ann.post('/models', { name, kind, params: {}, notes: `${name} notes` }).expect(201);
    }

    const all = await lib.kim.get('/models');
    const npns = await lib.kim.get('/models?kind=NPN');
    const text = await lib.kim.get('/models?q=gamma%20no');
    const page = await lib.kim.get('/models?limit=2&offset=2');

    expectShape(listResponseSchema(modelLibraryEntrySchema), all.body);
    expect(pluck(all.body, 'name')).toEqual(['Alpha', 'beta', 'Gamma', 'zeta']);
    expect(pluck(npns.body, 'name')).toEqual(['Alpha', 'beta']);
    expect(pluck(text.body, 'name')).toEqual(['Gamma']);
    expect(page.body).toMatchObject({ total: 4, items: [{ name: 'Gamma' }, { name: 'zeta' }] });
  });

  it('when a checker, approver or manager tries to change the library, then it answers 403', async () => {
    const model = await team.as.ann.post('/models', { ...npn, name: 'ROLEQ' });
    const statuses = [
      (await team.as.kim.post('/models', { ...npn, name: 'KIMQ' })).status,
      (await team.as.abe.patch(`/models/${model.body.id}`, { notes: 'x' })).status,
      (await team.as.max.delete(`/models/${model.body.id}`)).status,
    ];
    expect(statuses).toEqual([403, 403, 403]);
  });
});
