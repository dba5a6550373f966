import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { attachmentListSchema, attachmentSchema } from '@biasproof/shared';
import { createTestApp } from '../../test-support/test-app.ts';
import { insertFindingRow } from '../../test-support/fixtures.ts';
import { orgSnapshot } from '../../test-support/org-routes.ts';
import {
  auditEvents,
  createTeam,
  expectShape,
  newProject,
  newWorksheet,
  pluck,
  type Team,
} from '../../test-support/team.ts';
import { dividerDraft } from '../../worksheets/__tests__/worksheet-drafts.ts';
import { samples, sha256Hex, storedAttachments, upload } from './samples.ts';

describe('attachments: upload, list, download', () => {
  const t = createTestApp();
  let team: Team;
  let projectId: string;
  beforeAll(async () => {
    team = await createTeam(t);
    projectId = (await newProject(team.as.ann)).id;
  });
  afterAll(() => t.close());

  const draftOfAnn = () => newWorksheet(team.as.ann, projectId, dividerDraft());

  it('when the author uploads two files, then they list newest first and download byte for byte with their hash, size and safe headers, each step audited', async () => {
    const { ann, max } = team.as;
    const ws = await draftOfAnn();
    const pdf = samples.pdf();

    const first = await upload(ann, ws.id, { name: 'Datenblatt Ω.pdf', content: pdf });
    const second = await upload(ann, ws.id, { name: 'gain.csv', content: samples.csv() });

    expect(first.status, JSON.stringify(first.body)).toBe(201);
    expectShape(attachmentSchema, first.body);
    expect(first.body).toMatchObject({
      worksheetId: ws.id,
      findingId: null,
      revision: 'A',
      filename: 'Datenblatt Ω.pdf',
      type: 'pdf',
      contentType: 'application/pdf',
      size: pdf.length,
      sha256: sha256Hex(pdf),
      uploadedBy: { id: team.people.ann!.id, name: team.people.ann!.name },
    });
    expect(second.body).toMatchObject({ type: 'csv', contentType: 'text/csv; charset=utf-8' });
    const stored = await storedAttachments(t, ws.id);
    expect(stored[0]).toMatchObject({
      id: first.body.id,
      size: pdf.length,
      bytes: pdf.length,
      sha256: sha256Hex(pdf),
      content_sha256: sha256Hex(pdf),
      uploaded_by_user_id: team.people.ann!.id,
    });

    const list = await max.get(`/worksheets/${ws.id}/attachments`);
    expect(list.status).toBe(200);
    expectShape(attachmentListSchema, list.body);
    expect(pluck(list.body, 'id')).toEqual([second.body.id, first.body.id]);

    const download = await max.agent
      .get(max.url(`/attachments/${first.body.id}`))
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(download.status).toBe(200);
    expect(Buffer.compare(download.body as Buffer, pdf)).toBe(0);
    expect(download.headers['content-type']).toBe('application/pdf');
    expect(download.headers['content-disposition']).toBe(
      `attachment; filename="Datenblatt _.pdf"; filename*=UTF-8''Datenblatt%20%CE%A9.pdf`,
    );
    expect(download.headers['x-content-type-options']).toBe('nosniff');

    const uploaded = await auditEvents(t, team.org.id, 'attachment.uploaded');
    expect(uploaded.filter((e) => e.target_id === first.body.id)).toEqual([
      {
        actor_user_id: team.people.ann!.id,
        target_id: first.body.id,
        details: {
          worksheetId: ws.id,
          findingId: null,
          revision: 'A',
          filename: 'Datenblatt Ω.pdf',
          type: 'pdf',
          size: pdf.length,
          sha256: sha256Hex(pdf),
        },
      },
    ]);
    const downloaded = await auditEvents(t, team.org.id, 'attachment.downloaded');
    expect(downloaded.filter((e) => e.target_id === first.body.id)).toMatchObject([
      { actor_user_id: team.people.max!.id, details: { sha256: sha256Hex(pdf) } },
    ]);
  });

  it.each([
    ['a PDF renamed .png', 'scope.png', samples.pdf(), 'pdf', 'application/pdf'],
    ['a PNG renamed .pdf', 'report.pdf', samples.png(), 'png', 'image/png'],
    ['a deck renamed .csv', 'sweep.csv', samples.deck(), 'deck', 'text/plain; charset=utf-8'],
  ])(
    'when the file is %s, then its type comes from its content',
    async (_what, name, content, type, contentType) => {
      const ws = await draftOfAnn();
      const res = await upload(team.as.ann, ws.id, { name, content });
      expect(res.status, JSON.stringify(res.body)).toBe(201);
      expect(res.body).toMatchObject({ filename: name, type, contentType });
      expect(await storedAttachments(t, ws.id)).toMatchObject([{ type, filename: name }]);
    },
  );

  it('when a file is 21 MB, then it answers 413 naming the 20 MB limit and nothing is stored', async () => {
    const ws = await draftOfAnn();
    const before = await orgSnapshot(t, team.org.id);
    // A valid PDF header, so only the size can be the reason for refusing it.
    const big = Buffer.alloc(21 * 1024 * 1024, 0x20);
    samples.pdf().copy(big);
    const res = await upload(team.as.ann, ws.id, { name: 'huge.pdf', content: big });
    expect(res.status).toBe(413);
    expect(res.body.error).toEqual({
      code: 'payload-too-large',
      message: 'The file is larger than 20 MB, the most an attachment may be; nothing was stored.',
    });
    expect(await orgSnapshot(t, team.org.id)).toEqual(before);
  });

  it.each([
    ['an SVG', 'diagram.svg', samples.svg()],
    ['an SVG renamed .png', 'diagram.png', samples.svg()],
    ['a ZIP', 'bundle.csv', Buffer.from('504b030414000000080000', 'hex')],
  ])(
    'when the file is %s, then it answers 415 naming the allowed types and stores nothing',
    async (_what, name, content) => {
      const ws = await draftOfAnn();
      const before = await orgSnapshot(t, team.org.id);
      const res = await upload(team.as.ann, ws.id, { name, content });
      expect(res.status).toBe(415);
      expect(res.body.error.code).toBe('unsupported-media-type');
      expect(res.body.error.message).toContain('PDF, PNG, JPEG, CSV or a SPICE deck');
      expect(await orgSnapshot(t, team.org.id)).toEqual(before);
    },
  );

  it('when the request has no file, two files or an empty file, then it answers 400 and stores nothing', async () => {
    const { ann } = team.as;
    const ws = await draftOfAnn();
    const before = await orgSnapshot(t, team.org.id);
    const none = await ann.post(`/worksheets/${ws.id}/attachments`, { file: 'x' });
    const two = await upload(ann, ws.id, { name: 'a.png', content: samples.png() }).attach(
      'file',
      samples.png(),
      'b.png',
    );
    const empty = await upload(ann, ws.id, { name: 'empty.csv', content: Buffer.alloc(0) });
    expect([none.status, two.status, empty.status]).toEqual([400, 400, 400]);
    expect(none.body.error.message).toBe(
      'Send the file as multipart/form-data in a field named "file".',
    );
    expect(two.body.error.message).toBe('Send exactly one file, in the field named "file".');
    expect(empty.body.error.message).toBe('The file is empty.');
    expect(await orgSnapshot(t, team.org.id)).toEqual(before);
  });

  it('when a manager or an admin (who only view worksheets) uploads, then it answers 403 and stores nothing', async () => {
    const ws = await draftOfAnn();
    const before = await orgSnapshot(t, team.org.id);
    for (const viewer of [team.as.max, team.as.ada]) {
      const res = await upload(viewer, ws.id, { name: 'x.png', content: samples.png() });
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('forbidden');
    }
    const otherAuthor = await upload(team.as.bob, ws.id, { name: 'x.png', content: samples.png() });
    expect(otherAuthor.status).toBe(403);
    expect(otherAuthor.body.error.message).toBe(
      'Only the author of this worksheet, a checker or an approver may attach files to it.',
    );
    expect(await orgSnapshot(t, team.org.id)).toEqual(before);
  });

  it('when the checker attaches a file to a finding, then it lists under that finding only; a finding of another worksheet answers 404', async () => {
    const { kim, ann } = team.as;
    const ws = await draftOfAnn();
    const other = await draftOfAnn();
    const mine = { orgId: team.org.id, createdById: team.people.kim!.id };
    const findingId = await insertFindingRow(t, { ...mine, worksheetId: ws.id });
    const foreignFinding = await insertFindingRow(t, { ...mine, worksheetId: other.id });
    const onWorksheet = await upload(ann, ws.id, { name: 'ws.csv', content: samples.csv() });

    const onFinding = await upload(
      kim,
      ws.id,
      { name: 'probe.jpg', content: samples.jpeg() },
      { findingId },
    );
    const misplaced = await upload(
      kim,
      ws.id,
      { name: 'probe.jpg', content: samples.jpeg() },
      { findingId: foreignFinding },
    );

    expect(onFinding.status, JSON.stringify(onFinding.body)).toBe(201);
    expect(onFinding.body).toMatchObject({ findingId, type: 'jpeg' });
    expect(misplaced.status).toBe(404);
    const filtered = await ann.get(`/worksheets/${ws.id}/attachments?findingId=${findingId}`);
    expect(pluck(filtered.body, 'id')).toEqual([onFinding.body.id]);
    const all = await ann.get(`/worksheets/${ws.id}/attachments`);
    expect(all.body.total).toBe(2);
    expect(all.body.items[1].id).toBe(onWorksheet.body.id);
    expect(await storedAttachments(t, ws.id)).toMatchObject([
      { finding_id: null },
      { finding_id: findingId },
    ]);
    expect(await storedAttachments(t, other.id)).toEqual([]);
  });

  it('when an attachment of another organization is downloaded or deleted, then it answers 404 and nothing changes in either', async () => {
    const other = await createTeam(t);
    const otherProject = await newProject(other.as.ann);
    const otherWs = await newWorksheet(other.as.ann, otherProject.id, dividerDraft());
    const theirs = await upload(other.as.ann, otherWs.id, {
      name: 's.png',
      content: samples.png(),
    });
    expect(theirs.status).toBe(201);
    const before = [await orgSnapshot(t, team.org.id), await orgSnapshot(t, other.org.id)];

    const read = await team.as.ann.get(`/attachments/${theirs.body.id}`);
    const removed = await team.as.ann.delete(`/attachments/${theirs.body.id}`);
    const listed = await team.as.ann.get(`/worksheets/${otherWs.id}/attachments`);

    expect([read.status, removed.status, listed.status]).toEqual([404, 404, 404]);
    expect(read.body.error.code).toBe('not-found');
    expect([await orgSnapshot(t, team.org.id), await orgSnapshot(t, other.org.id)]).toEqual(before);
  });
});
