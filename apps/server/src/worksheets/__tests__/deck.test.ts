import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseDeck } from '@biasproof/calc';
import { importDeckResponseSchema } from '@biasproof/shared';
import { createTestApp } from '../../test-support/test-app.ts';
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
import { dividerDraft } from './worksheet-drafts.ts';

const goodDeck = [
  'Clamp with a 1N-style diode',
  '* example values',
  'V1 in 0 DC 5 AC 1',
  'R1 in a 4k7',
  'D1 a 0 DSW',
  '+ AREA=1',
  '.model DSW D (IS=4n N=1.9 RS=0.6)',
  '.temp 50',
  '.ac dec 10 10 1meg',
  '.tran 1u 1m',
  '.op',
  '.end',
].join('\n');

describe('worksheets: SPICE decks', () => {
  const t = createTestApp();
  let team: Team;
  let projectId: string;
  beforeAll(async () => {
    team = await createTeam(t);
    projectId = (await newProject(team.as.ann, { code: 'DECK' })).id;
  });
  afterAll(() => t.close());

  it('when the deck is exported, then it is a text attachment that reads back as the same circuit', async () => {
    const ws = await newWorksheet(team.as.ann, projectId, {
      title: 'Divider A/B',
      ...dividerDraft(),
    });

    const res = await team.as.kim.get(`/worksheets/${ws.id}/deck`);

    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('text/plain; charset=utf-8');
    expect(res.headers['content-disposition']).toBe(
      'attachment; filename=deck-divider-a-b-rev-a.cir',
    );
    expect(res.text).toContain('.op\n');
    expect(res.text.endsWith('.end\n')).toBe(true);
    expect(parseDeck(res.text).circuit.elements).toEqual(
      dividerDraft().circuit.elements.map((e) => ({ ...e, name: e.name })),
    );

    const reimported = await team.as.ann.post(`/worksheets/${ws.id}/deck`, {
      text: res.text,
      version: 1,
    });
    expect(reimported.status).toBe(200);
    expect(reimported.body.worksheet.version).toBe(1);
    expect(reimported.body.worksheet.currentRevision.contentHash).toBe(
      ws.currentRevision.contentHash,
    );
  });

  it('when a deck is uploaded as text, then the draft takes its circuit, .temp and .ac, is recomputed, and skipped cards come back as warnings', async () => {
    const ws = await newWorksheet(team.as.ann, projectId, { title: 'Clamp', ...dividerDraft() });

    const res = await team.as.ann.agent
      .post(team.as.ann.url(`/worksheets/${ws.id}/deck?version=1`))
      .set('x-csrf-token', team.as.ann.csrf)
      .set('content-type', 'text/plain')
      .send(goodDeck);

    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expectShape(importDeckResponseSchema, res.body);
    const { worksheet, warnings } = res.body;
    expect(warnings).toEqual([
      { line: 10, message: expect.stringContaining('.tran'), text: '.tran 1u 1m' },
    ]);
    expect(worksheet.version).toBe(2);
    expect(pluck({ items: worksheet.currentRevision.circuit.elements }, 'name')).toEqual([
      'V1',
      'R1',
      'D1',
    ]);
    expect(worksheet.currentRevision.settings).toMatchObject({
      temperature: 50,
      sweep: { type: 'dec', points: 10, fstart: 10, fstop: 1e6 },
      inputSource: 'V1',
    });
    expect(worksheet.currentRevision.results.bias.devices.d1.region).toBe('forward');
    expect(worksheet.currentRevision.contentHash).not.toBe(ws.currentRevision.contentHash);
    const [event] = (await auditEvents(t, team.org.id, 'worksheet.deck-imported')).filter(
      (e) => e.target_id === ws.id,
    );
    expect(event?.details).toMatchObject({
      version: 2,
      changed: ['circuit', 'settings'],
      elements: 3,
      warnings: 1,
    });
  });

  it('when the deck has an error, then it answers 400 naming the line and nothing is saved', async () => {
    const ws = await newWorksheet(team.as.ann, projectId, { title: 'Broken', ...dividerDraft() });
    const before = await orgSnapshot(t, team.org.id);
    const text = goodDeck.replace('R1 in a 4k7', 'R1 in a');

    const res = await team.as.ann.post(`/worksheets/${ws.id}/deck`, { text, version: 1 });
    const unknownModel = await team.as.ann.post(`/worksheets/${ws.id}/deck`, {
      text: goodDeck.replace('D1 a 0 DSW', 'D1 a 0 DXX'),
    });

    expect(res.status).toBe(400);
    expect(res.body.error).toEqual({
      code: 'validation-failed',
      message: 'The deck was not imported: line 4: R1 is incomplete; expected R1 n1 n2 resistance',
      fields: { 'line 4': 'R1 is incomplete; expected R1 n1 n2 resistance' },
    });
    expect(unknownModel.status).toBe(400);
    expect(unknownModel.body.error.fields).toEqual({ 'line 5': expect.stringContaining("'DXX'") });
    expect(await orgSnapshot(t, team.org.id)).toEqual(before);
  });

  it('when the deck import carries a stale version, then it answers 409 and nothing is saved', async () => {
    const ws = await newWorksheet(team.as.ann, projectId, { title: 'Raced', ...dividerDraft() });
    await team.as.ann
      .patch(`/worksheets/${ws.id}`, { version: 1, title: 'Raced, renamed' })
      .expect(200);
    const before = await orgSnapshot(t, team.org.id);

    const res = await team.as.ann.post(`/worksheets/${ws.id}/deck`, { text: goodDeck, version: 1 });

    expect(res.status).toBe(409);
    expect(res.body.error.fields).toEqual({ version: '2' });
    expect(await orgSnapshot(t, team.org.id)).toEqual(before);
  });

  it('when a deck is larger than 256 kB or comes from a non-author, then it is refused and nothing is saved', async () => {
    const ws = await newWorksheet(team.as.ann, projectId, { title: 'Huge', ...dividerDraft() });
    const before = await orgSnapshot(t, team.org.id);
    const huge = `title\n${'* filler line of a very long comment block\n'.repeat(7000)}.end\n`;

    const asText = await team.as.ann.agent
      .post(team.as.ann.url(`/worksheets/${ws.id}/deck`))
      .set('x-csrf-token', team.as.ann.csrf)
      .set('content-type', 'text/plain')
      .send(huge);
    const asJson = await team.as.ann.post(`/worksheets/${ws.id}/deck`, { text: huge });
    const byChecker = await team.as.kim.post(`/worksheets/${ws.id}/deck`, { text: goodDeck });

    expect(asText.status).toBe(413);
    expect(asText.body.error.code).toBe('payload-too-large');
    expect(asJson.status).toBe(400);
    expect(asJson.body.error.fields).toEqual({ text: 'The deck is larger than 256 kB.' });
    expect(byChecker.status).toBe(403);
    expect(await orgSnapshot(t, team.org.id)).toEqual(before);
  });
});
