import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp } from '../../test-support/test-app.ts';
import { systemRows } from '../../test-support/fixtures.ts';
import { orgSnapshot } from '../../test-support/org-routes.ts';
import {
  auditEvents,
  createTeam,
  newProject,
  newWorksheet,
  type Team,
} from '../../test-support/team.ts';
import { dividerDraft, dividerWithR2 } from '../../worksheets/__tests__/worksheet-drafts.ts';
import { createOrgContext } from '../../orgs/org-scope.ts';
import { listAttachmentsForRevision } from '../repository.ts';
import { samples, sha256Hex, storedAttachments, upload } from './samples.ts';

describe('attachments: deleting, and the record of frozen revisions', () => {
  const t = createTestApp();
  let team: Team;
  let projectId: string;
  beforeAll(async () => {
    team = await createTeam(t);
    projectId = (await newProject(team.as.ann)).id;
  });
  afterAll(() => t.close());

  /** Ann's draft with Kim as checker and Abe as approver (version 2), so it may be submitted. */
  async function assignedDraft() {
    const ws = await newWorksheet(team.as.ann, projectId, dividerDraft());
    const res = await team.as.ann.patch(`/worksheets/${ws.id}`, {
      version: 1,
      checkerId: team.people.kim!.id,
      approverId: team.people.abe!.id,
    });
    expect(res.status).toBe(200);
    return ws;
  }
  const step = (who: 'ann' | 'kim', id: string, body: object) =>
    team.as[who].post(`/worksheets/${id}/transitions`, body);

  it('when the uploader deletes an attachment of the current draft revision, then it is gone and audited; nobody else may delete it', async () => {
    const ws = await assignedDraft();
    const csv = samples.csv();
    const added = await upload(team.as.ann, ws.id, { name: 'gain.csv', content: csv });
    const before = await orgSnapshot(t, team.org.id);

    const byChecker = await team.as.kim.delete(`/attachments/${added.body.id}`);
    const byManager = await team.as.max.delete(`/attachments/${added.body.id}`);
    expect([byChecker.status, byManager.status]).toEqual([403, 403]);
    expect(byChecker.body.error.message).toBe(
      'Only the person who uploaded this attachment may delete it.',
    );
    expect(await orgSnapshot(t, team.org.id)).toEqual(before);

    const res = await team.as.ann.delete(`/attachments/${added.body.id}`);

    expect(res.status).toBe(204);
    expect(await storedAttachments(t, ws.id)).toEqual([]);
    expect(await team.as.ann.get(`/attachments/${added.body.id}`)).toMatchObject({ status: 404 });
    expect(await auditEvents(t, team.org.id, 'attachment.deleted')).toContainEqual({
      actor_user_id: team.people.ann!.id,
      target_id: added.body.id,
      details: {
        worksheetId: ws.id,
        findingId: null,
        revision: 'A',
        filename: 'gain.csv',
        type: 'csv',
        size: csv.length,
        sha256: sha256Hex(csv),
      },
    });
  });

  it('when the revision was submitted (frozen), then its attachment cannot be deleted, in check or after the return, by the API or by SQL', async () => {
    const ws = await assignedDraft();
    const added = await upload(team.as.ann, ws.id, { name: 'scope.png', content: samples.png() });
    expect((await step('ann', ws.id, { action: 'submit', version: 2 })).status).toBe(200);
    // The checker adds evidence while in check: it belongs to frozen revision A too.
    const byChecker = await upload(team.as.kim, ws.id, {
      name: 'probe.pdf',
      content: samples.pdf(),
    });
    expect(byChecker.body).toMatchObject({ revision: 'A' });
    const before = await orgSnapshot(t, team.org.id);

    const inCheck = await team.as.ann.delete(`/attachments/${added.body.id}`);
    expect(inCheck.status).toBe(409);
    expect(inCheck.body.error.message).toBe(
      'This worksheet is in check; attachments can be deleted only while it is a draft or returned.',
    );

    expect((await step('kim', ws.id, { action: 'return', version: 3 })).status).toBe(200);
    const returned = await team.as.ann.delete(`/attachments/${added.body.id}`);
    expect(returned.status).toBe(409);
    const edited = await team.as.ann.patch(`/worksheets/${ws.id}`, {
      version: 4,
      circuit: dividerWithR2(660),
    });
    expect(edited.body).toMatchObject({ revision: 'B' });
    const afterRevisionB = await team.as.ann.delete(`/attachments/${added.body.id}`);
    expect(afterRevisionB.status).toBe(409);
    expect(afterRevisionB.body.error.message).toBe(
      'This attachment belongs to revision A, which is frozen: it is part of the record and cannot be deleted.',
    );
    const { attachments } = await orgSnapshot(t, team.org.id);
    expect(attachments).toEqual(before.attachments);

    await expect(
      systemRows(t, 'DELETE FROM attachments WHERE id = $1 RETURNING id', [added.body.id]),
    ).rejects.toThrow(/cannot be changed, or removed from a frozen revision/);
    await expect(
      systemRows(t, "UPDATE attachments SET filename = 'x.png' WHERE id = $1 RETURNING id", [
        added.body.id,
      ]),
    ).rejects.toThrow(/cannot be changed/);
    expect(await storedAttachments(t, ws.id)).toHaveLength(2);
  });

  it('when the worksheet is withdrawn, then it takes no more attachments', async () => {
    const ws = await assignedDraft();
    expect((await step('ann', ws.id, { action: 'withdraw', version: 2 })).status).toBe(200);
    const res = await upload(team.as.ann, ws.id, { name: 'late.png', content: samples.png() });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe(
      'This worksheet is withdrawn; its record no longer takes attachments.',
    );
    expect(await storedAttachments(t, ws.id)).toEqual([]);
  });

  it('when the record package asks for a revision’s attachments, then it gets each one’s metadata and exact bytes, oldest first', async () => {
    const ws = await assignedDraft();
    const pdf = samples.pdf();
    const png = samples.png();
    const a = await upload(team.as.ann, ws.id, { name: 'a.pdf', content: pdf });
    const b = await upload(team.as.kim, ws.id, { name: 'b.png', content: png });
    const org = createOrgContext(t.sequelize, team.org.id, {
      userId: team.people.max!.id,
      roles: ['manager'],
    });

    const files = await org.read((tx) => listAttachmentsForRevision(tx, ws.id, 'A'));
    const none = await org.read((tx) => listAttachmentsForRevision(tx, ws.id, 'B'));

    expect(files.map((f) => [f.id, f.filename, f.sha256, f.size])).toEqual([
      [a.body.id, 'a.pdf', sha256Hex(pdf), pdf.length],
      [b.body.id, 'b.png', sha256Hex(png), png.length],
    ]);
    expect(files.map((f) => sha256Hex(f.content))).toEqual([sha256Hex(pdf), sha256Hex(png)]);
    expect(none).toEqual([]);
  });
});
