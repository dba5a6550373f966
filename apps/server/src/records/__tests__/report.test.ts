import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createHash } from 'node:crypto';
import { formatValue } from '@biasproof/calc';
import { decodeResults } from '@biasproof/shared';
import { createTestApp } from '../../test-support/test-app.ts';
import { createTeam, newProject, newWorksheet, type Team } from '../../test-support/team.ts';
import { systemRows } from '../../test-support/fixtures.ts';
import { amplifierDraft } from '../sample-record.ts';
import {
  contentStreams,
  download,
  inkPerPage,
  pdfText,
  signedAmplifier,
  withoutGenerationLine,
  type SignedWorksheet,
} from './record-steps.ts';

/**
 * The time as the organization's clock showed it, worked out independently of the report's
 * own formatter: Intl's `sv-SE` locale writes `YYYY-MM-DD HH:mm:ss`, `longOffset` the offset.
 */
function berlinTime(iso: string): string {
  const date = new Date(iso);
  const local = new Intl.DateTimeFormat('sv-SE', {
    timeZone: 'Europe/Berlin',
    dateStyle: 'short',
    timeStyle: 'medium',
  }).format(date);
  const offset = new Intl.DateTimeFormat('en', {
    timeZone: 'Europe/Berlin',
    timeZoneName: 'longOffset',
  })
    .formatToParts(date)
    .find((p) => p.type === 'timeZoneName')!
    .value.replace('GMT', '');
  return `${local} ${offset || '+00:00'}`;
}

describe('the PDF report of a revision', () => {
  const t = createTestApp();
  let team: Team;
  let ws: SignedWorksheet;
  let pdf: Buffer;
  beforeAll(async () => {
    team = await createTeam(t);
    ws = await signedAmplifier(team);
    const res = await download(team.as.max, `/worksheets/${ws.id}/revisions/A/report.pdf`);
    expect(res.status).toBe(200);
    pdf = res.body as Buffer;
  });
  afterAll(() => t.close());

  it('when any member downloads the report of a signed revision, then it is a PDF whose text names the worksheet, revision, hash, bias numbers with units and every signature, and the download is audited', async () => {
    const res = await download(team.as.bob, `/worksheets/${ws.id}/revisions/A/report.pdf`);

    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toMatch(
      /^attachment; filename=[a-z0-9]+-preamp-bias-rev-a-report\.pdf$/,
    );
    const body = res.body as Buffer;
    expect(body.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const text = pdfText(body);
    expect(text).toContain('Preamp bias, revision A');
    expect(text).toContain(ws.contentHash);
    expect(text).toContain('Signed off');
    // Key bias numbers, formatted with the engine's own formatter from the stored results.
    const [stored] = await systemRows<{ results: unknown }>(
      t,
      'SELECT results FROM revisions WHERE worksheet_id = $1',
      [ws.id],
    );
    const results = decodeResults(stored!.results);
    if (results.status !== 'solved') throw new Error('the amplifier must solve');
    const q1 = results.bias.devices.q1!;
    if (q1.kind !== 'Q') throw new Error('q1 is a BJT');
    const ib = formatValue(q1.ib, 'A', { digits: 4 });
    const ic = formatValue(q1.ic, 'A', { digits: 4 });
    const rpi = formatValue(q1.rpi, 'Ω', { digits: 4 });
    const vout = formatValue(results.bias.nodes.c1!, 'V', { digits: 4 });
    expect([ib, rpi]).toEqual([expect.stringContaining('µA'), expect.stringContaining('kΩ')]);
    for (const value of [ib, ic, rpi, vout]) expect(text).toContain(value);
    expect(text).toMatch(/Q1 \(NPN\)\s+active/);
    // The signature's manifestation: printed name, time in the organization's zone, meaning.
    const [signature] = await systemRows<{
      printed_name: string;
      signed_at: Date;
      meaning: string;
    }>(t, 'SELECT printed_name, signed_at, meaning FROM signatures WHERE worksheet_id = $1', [
      ws.id,
    ]);
    expect(text).toMatch(new RegExp(`Printed name\\s+${signature!.printed_name}`));
    expect(text).toContain(berlinTime(signature!.signed_at.toISOString()));
    expect(text).toContain('Approved for release');
    expect(text).not.toContain('NOT SIGNED');
    // The finding with its thread, and the caution statement.
    expect(text).toContain('Is IC within the 1 mA ± 10 % budget?');
    expect(text).toContain('Yes: 1.36 mA is the intended point.');
    expect(text).toMatch(/Resolution: Closed/);
    expect(text).toContain('local codes');
    const events = await systemRows<{ actor_user_id: string; details: Record<string, unknown> }>(
      t,
      `SELECT actor_user_id, details FROM audit_events WHERE org_id = $1 AND action = 'record.report-downloaded' ORDER BY seq`,
      [team.org.id],
    );
    expect(events.at(-1)).toEqual({
      actor_user_id: team.people.bob!.id,
      details: expect.objectContaining({
        worksheetId: ws.id,
        revision: 'A',
        contentHash: ws.contentHash,
        sha256: createHash('sha256').update(body).digest('hex'),
      }),
    });
  });

  it('when the report is rendered page by page, then every page has ink, the header hash and "page X of Y"', () => {
    const ink = inkPerPage(pdf);
    const pages = (pdf.toString('latin1').match(/\/Type \/Page\b/g) ?? []).length;
    expect(ink).toHaveLength(pages);
    expect(pages).toBeGreaterThanOrEqual(4);
    // Counted between header and footer: a few lines of text are several hundred dark pixels.
    for (const dark of ink) expect(dark).toBeGreaterThan(300);
    for (let page = 1; page <= pages; page++) {
      const text = pdfText(pdf, page);
      expect(text).toContain(`page ${page} of ${pages}`);
      expect(text).toContain(ws.contentHash);
    }
  });

  it('when the plots are drawn, then they are vector paths (long runs of lineto), and the file holds no raster image', () => {
    const streams = contentStreams(pdf).join('\n');
    // Each load line's device curve is 101 points, the Bode plot one point per frequency: a
    // polyline of 80 or more `l` operators in a row exists only if a curve was drawn as a path.
    const runs = streams.match(/(?:[-\d.]+ [-\d.]+ l\n){80,}/g) ?? [];
    expect(runs.length).toBeGreaterThanOrEqual(3);
    expect(pdf.toString('latin1')).not.toMatch(/\/Subtype \/Image/);
  });

  it('when the same revision is reported twice, then the text is the same except the generation line', async () => {
    const again = await download(team.as.max, `/worksheets/${ws.id}/revisions/A/report.pdf`);

    const first = pdfText(pdf);
    const second = pdfText(again.body as Buffer);
    expect(first).toMatch(/Generated \d{4}-\d\d-\d\d \d\d:\d\d:\d\d [+-]\d\d:\d\d for Max Fixture/);
    expect(withoutGenerationLine(second)).toBe(withoutGenerationLine(first));
  });

  it('when a draft revision is reported, then every page carries the NOT SIGNED mark', async () => {
    const project = await newProject(team.as.ann);
    const draft = await newWorksheet(team.as.ann, project.id, {
      title: 'Unsigned draft',
      ...amplifierDraft(1),
    });

    const res = await download(team.as.kim, `/worksheets/${draft.id}/revisions/A/report.pdf`);

    expect(res.status).toBe(200);
    const body = res.body as Buffer;
    const pages = (body.toString('latin1').match(/\/Type \/Page\b/g) ?? []).length;
    for (let page = 1; page <= pages; page++) expect(pdfText(body, page)).toContain('NOT SIGNED');
    expect(pdfText(body)).toContain('This revision carries no signature');
  });

  it('when the revision letter is unknown or malformed, then the answer is 404 and nothing is audited', async () => {
    const before = await systemRows(t, 'SELECT count(*) AS n FROM audit_events WHERE org_id = $1', [
      team.org.id,
    ]);
    for (const letter of ['B', 'a', 'A1', 'ABCD']) {
      const res = await team.as.max.get(`/worksheets/${ws.id}/revisions/${letter}/report.pdf`);
      expect(res.status, letter).toBe(404);
      expect(res.body.error.code).toBe('not-found');
    }
    expect(
      await systemRows(t, 'SELECT count(*) AS n FROM audit_events WHERE org_id = $1', [
        team.org.id,
      ]),
    ).toEqual(before);
  });
});
