import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ENGINE_VERSION } from '@biasproof/calc';
import { worksheetSchema } from '@biasproof/shared';
import { createTestApp } from '../../test-support/test-app.ts';
import { systemRows } from '../../test-support/fixtures.ts';
import { orgSnapshot } from '../../test-support/org-routes.ts';
import {
  auditEvents,
  createTeam,
  expectShape,
  newProject,
  newWorksheet,
  storedWorksheet,
  type Team,
} from '../../test-support/team.ts';
import { dividerDraft, dividerWithR2 } from './worksheet-drafts.ts';

describe('worksheets: saving, recomputing and assigning', () => {
  const t = createTestApp();
  let team: Team;
  let projectId: string;
  beforeAll(async () => {
    team = await createTeam(t);
    projectId = (await newProject(team.as.ann)).id;
  });
  afterAll(() => t.close());

  const divider = () => newWorksheet(team.as.ann, projectId, dividerDraft());
  const hashOf = (body: { currentRevision: { contentHash: string } }) =>
    body.currentRevision.contentHash;

  it('when the author saves a new title with the current version, then the version goes up by one and one audit event records it', async () => {
    const ws = await divider();

    const res = await team.as.ann.patch(`/worksheets/${ws.id}`, {
      version: 1,
      title: 'Divider, 1 % parts',
    });

    expect(res.status).toBe(200);
    expectShape(worksheetSchema, res.body);
    expect(res.body).toMatchObject({ title: 'Divider, 1 % parts', version: 2 });
    expect(hashOf(res.body)).toBe(hashOf(ws));
    expect((await storedWorksheet(t, ws.id)).worksheet).toMatchObject({
      title: 'Divider, 1 % parts',
      version: 2,
    });
    const events = (await auditEvents(t, team.org.id, 'worksheet.updated')).filter(
      (e) => e.target_id === ws.id,
    );
    expect(events).toEqual([
      {
        actor_user_id: team.people.ann!.id,
        target_id: ws.id,
        details: { version: 2, revision: 'A', changed: ['title'] },
      },
    ]);
  });

  it('when inputs change, then the hash changes; when they come back or are sent unchanged, then it is the same hash again', async () => {
    const ws = await divider();
    const original = hashOf(ws);

    const recomputed = await team.as.ann.post(`/worksheets/${ws.id}/compute`);
    const resistor = await team.as.ann.patch(`/worksheets/${ws.id}`, {
      version: 1,
      circuit: dividerWithR2(2200),
    });
    const settings = await team.as.ann.patch(`/worksheets/${ws.id}`, {
      version: 2,
      settings: { ...dividerDraft().settings, temperature: 85 },
    });
    const unchanged = await team.as.ann.patch(`/worksheets/${ws.id}`, {
      version: 3,
      circuit: dividerWithR2(2200),
    });
    const back = await team.as.ann.patch(`/worksheets/${ws.id}`, { version: 3, ...dividerDraft() });

    expect(recomputed.status).toBe(200);
    expect([hashOf(recomputed.body), recomputed.body.version]).toEqual([original, 1]);
    expect(resistor.body.currentRevision.results.bias.nodes.out).toBeCloseTo((5 * 2200) / 3200, 12);
    const hashes = [resistor, settings, unchanged, back].map((r) => hashOf(r.body));
    expect(new Set([original, hashes[0], hashes[1]]).size).toBe(3);
    expect(hashes[2]).toBe(hashes[1]);
    expect(unchanged.body.version).toBe(3);
    expect(hashes[3]).toBe(original);
    expect(back.body.version).toBe(4);
    const events = (await auditEvents(t, team.org.id, 'worksheet.updated')).filter(
      (e) => e.target_id === ws.id,
    );
    expect(events.map((e) => e.details.changed)).toEqual([
      ['circuit'],
      ['settings'],
      ['circuit', 'settings'],
    ]);
    expect(events.map((e) => e.details.contentHash)).toEqual([hashes[0], hashes[1], original]);
    expect(await auditEvents(t, team.org.id, 'worksheet.computed')).toEqual([]);
  });

  it('when results were stored by another engine version, then a recompute stores this engine’s results and version and audits it', async () => {
    const ws = await divider();
    await systemRows(
      t,
      `UPDATE revisions SET engine_version = '0.0.1-old' WHERE worksheet_id = $1 RETURNING id`,
      [ws.id],
    );

    const res = await team.as.ann.post(`/worksheets/${ws.id}/compute`);

    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      version: 2,
      currentRevision: { engineVersion: ENGINE_VERSION },
    });
    expect(hashOf(res.body)).toBe(hashOf(ws));
    const [event] = (await auditEvents(t, team.org.id, 'worksheet.computed')).filter(
      (e) => e.target_id === ws.id,
    );
    expect(event?.details).toMatchObject({
      version: 2,
      previousEngineVersion: '0.0.1-old',
      engineVersion: ENGINE_VERSION,
      contentHash: hashOf(ws),
      previousHash: hashOf(ws),
    });
  });

  it('when two people save from the same version, then the second answers 409 stale-version with the current version and changes nothing', async () => {
    const ws = await divider();
    await team.as.ann
      .patch(`/worksheets/${ws.id}`, { version: 1, description: 'first save' })
      .expect(200);
    const before = await orgSnapshot(t, team.org.id);

    const stale = await team.as.ann.patch(`/worksheets/${ws.id}`, {
      version: 1,
      circuit: dividerWithR2(10),
    });
    const staleAssign = await team.as.max.patch(`/worksheets/${ws.id}`, {
      version: 1,
      checkerId: team.people.kim!.id,
    });

    for (const res of [stale, staleAssign]) {
      expect(res.status).toBe(409);
      expect(res.body.error).toEqual({
        code: 'stale-version',
        message: expect.stringContaining('version 2'),
        fields: { version: '2' },
      });
    }
    expect(await orgSnapshot(t, team.org.id)).toEqual(before);
  });

  it('when a save carries bad fields, then it answers 400 with a message per field and changes nothing', async () => {
    const ws = await divider();
    const before = await orgSnapshot(t, team.org.id);

    const res = await team.as.ann.patch(`/worksheets/${ws.id}`, {
      version: 1,
      title: '  ',
      circuit: { elements: [{ kind: 'Q', name: 'Q1', nodes: ['c', 'b'], model: 'QN' }] },
      settings: {
        ...dividerDraft().settings,
        sweep: { type: 'dec', points: 5000, fstart: 1, fstop: 1e9 },
      },
      checkerId: 'kim',
    });
    const nothing = await team.as.ann.patch(`/worksheets/${ws.id}`, { version: 1 });

    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({
      title: 'Enter a title.',
      'circuit.elements.0.nodes': expect.any(String),
      'settings.sweep': expect.stringContaining('more than 2001 frequencies'),
      checkerId: 'Choose a member of this organization.',
    });
    expect(nothing.status).toBe(400);
    expect(nothing.body.error.fields).toEqual({ _: 'Nothing to change.' });
    expect(await orgSnapshot(t, team.org.id)).toEqual(before);
  });

  it('when someone other than the author edits, then it answers 403 and changes nothing; a manager may assign but not edit', async () => {
    const ws = await divider();
    const before = await orgSnapshot(t, team.org.id);

    const otherAuthor = await team.as.bob.patch(`/worksheets/${ws.id}`, {
      version: 1,
      title: 'Mine now',
    });
    const checker = await team.as.kim.patch(`/worksheets/${ws.id}`, {
      version: 1,
      title: 'Checked',
    });
    const managerEdit = await team.as.max.patch(`/worksheets/${ws.id}`, {
      version: 1,
      title: 'Managed',
    });
    const otherCompute = await team.as.bob.post(`/worksheets/${ws.id}/compute`);
    const checkerAssign = await team.as.kim.patch(`/worksheets/${ws.id}`, {
      version: 1,
      checkerId: team.people.kim!.id,
    });

    for (const res of [otherAuthor, checker, managerEdit, otherCompute, checkerAssign]) {
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('forbidden');
    }
    expect(await orgSnapshot(t, team.org.id)).toEqual(before);

    const assigned = await team.as.max.patch(`/worksheets/${ws.id}`, {
      version: 1,
      checkerId: team.people.kim!.id,
      approverId: team.people.abe!.id,
    });
    expect(assigned.status).toBe(200);
    expect(assigned.body).toMatchObject({
      version: 2,
      checker: { id: team.people.kim!.id, name: team.people.kim!.name },
      approver: { id: team.people.abe!.id, name: team.people.abe!.name },
    });
    const [event] = (await auditEvents(t, team.org.id, 'worksheet.assigned')).filter(
      (e) => e.target_id === ws.id,
    );
    expect(event).toMatchObject({
      actor_user_id: team.people.max!.id,
      details: {
        changed: ['checkerId', 'approverId'],
        before: { checkerId: null, approverId: null },
        after: { checkerId: team.people.kim!.id, approverId: team.people.abe!.id },
      },
    });
  });

  it('when the assignees do not hold the role, are the author, or are one person for both, then it answers 400 and changes nothing', async () => {
    const own = await newWorksheet(team.as.cal, projectId, dividerDraft());
    const ws = await divider();
    const before = await orgSnapshot(t, team.org.id);
    const outsider = (await createTeam(t)).people.kim!.id;

    const wrongRole = await team.as.ann.patch(`/worksheets/${ws.id}`, {
      version: 1,
      checkerId: team.people.abe!.id,
      approverId: outsider,
    });
    const self = await team.as.cal.patch(`/worksheets/${own.id}`, {
      version: 1,
      checkerId: team.people.cal!.id,
      approverId: team.people.cal!.id,
    });
    const same = await team.as.ann.patch(`/worksheets/${ws.id}`, {
      version: 1,
      checkerId: team.people.cal!.id,
      approverId: team.people.cal!.id,
    });

    expect(wrongRole.body.error.fields).toEqual({
      checkerId: 'Choose a member of this organization who holds the checker role.',
      approverId: 'Choose a member of this organization who holds the approver role.',
    });
    expect(self.body.error.fields).toEqual({
      checkerId: 'The author cannot check their own worksheet; choose another checker.',
      approverId: 'The author cannot sign off their own worksheet; choose another approver.',
    });
    expect(same.body.error.fields).toEqual({
      approverId: 'The checker of a worksheet cannot also sign it off; choose different people.',
    });
    expect([wrongRole.status, self.status, same.status]).toEqual([400, 400, 400]);
    expect(await orgSnapshot(t, team.org.id)).toEqual(before);
  });

  it('when the worksheet is in check or its revision is frozen, then edits and recomputes answer 409 and change nothing', async () => {
    const inCheck = await divider();
    const frozen = await divider();
    await systemRows(t, `UPDATE worksheets SET state = 'in_check' WHERE id = $1 RETURNING id`, [
      inCheck.id,
    ]);
    await systemRows(t, `UPDATE revisions SET frozen = true WHERE worksheet_id = $1 RETURNING id`, [
      frozen.id,
    ]);
    const before = await orgSnapshot(t, team.org.id);

    const edit = await team.as.ann.patch(`/worksheets/${inCheck.id}`, {
      version: 1,
      title: 'Late edit',
    });
    const compute = await team.as.ann.post(`/worksheets/${inCheck.id}/compute`);
    const frozenEdit = await team.as.ann.patch(`/worksheets/${frozen.id}`, {
      version: 1,
      circuit: dividerWithR2(1),
    });
    const frozenCompute = await team.as.ann.post(`/worksheets/${frozen.id}/compute`);

    expect(edit.body.error).toEqual({
      code: 'conflict',
      message: 'This worksheet is in check; only a draft or a returned worksheet can be changed.',
    });
    expect(compute.status).toBe(409);
    expect(frozenEdit.body.error).toEqual({
      code: 'conflict',
      message: 'Revision A is frozen and cannot be changed.',
    });
    expect(frozenCompute.status).toBe(409);
    expect([edit.status, frozenEdit.status]).toEqual([409, 409]);
    expect(await orgSnapshot(t, team.org.id)).toEqual(before);
  });

  it('when another organization’s worksheet is changed or recomputed by id, then it answers 404 and nothing changes', async () => {
    const other = await createTeam(t);
    const foreign = await newWorksheet(
      other.as.ann,
      (await newProject(other.as.ann)).id,
      dividerDraft(),
    );
    const before = await orgSnapshot(t, other.org.id);

    const patch = await team.as.ann.patch(`/worksheets/${foreign.id}`, { version: 1, title: 'x' });
    const compute = await team.as.ann.post(`/worksheets/${foreign.id}/compute`);
    const deck = await team.as.ann.post(`/worksheets/${foreign.id}/deck`, {
      text: 't\nR1 a 0 1k\n.end',
    });

    for (const res of [patch, compute, deck]) expect(res.status).toBe(404);
    expect(await orgSnapshot(t, other.org.id)).toEqual(before);
  });
});
