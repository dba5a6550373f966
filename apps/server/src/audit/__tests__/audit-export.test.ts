import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp } from '../../test-support/test-app.ts';
import { systemRows } from '../../test-support/fixtures.ts';
import { createTeam, newProject, newWorksheet, type Team } from '../../test-support/team.ts';
import { dividerDraft } from '../../worksheets/__tests__/worksheet-drafts.ts';
import { auditCsv, csvCell } from '../csv.ts';

/** RFC 4180 read back: quoted cells may hold commas, doubled quotes and line breaks. */
function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let cell = '';
  let quoted = false;
  for (let i = 0; i < text.length; i += 1) {
    const c = text[i]!;
    if (quoted && c === '"' && text[i + 1] === '"') {
      cell += '"';
      i += 1;
    } else if (c === '"') {
      quoted = !quoted;
    } else if (!quoted && c === ',') {
      row.push(cell);
      cell = '';
    } else if (!quoted && c === '\r' && text[i + 1] === '\n') {
      rows.push([...row, cell]);
      row = [];
      cell = '';
      i += 1;
    } else {
      cell += c;
    }
  }
  return rows;
}

const header = [
  'at',
  'actor',
  'actorId',
  'action',
  'summary',
  'targetType',
  'targetId',
  'projectId',
  'worksheetId',
  'revision',
  'ip',
  'userAgent',
  'details',
  'eventId',
];

describe('audit log export as CSV', () => {
  const t = createTestApp();
  let team: Team;
  let worksheetId: string;
  const title = 'Preamp, "quiet" input';
  const hostileAgent = '=HYPERLINK("http://attacker.example","open")';
  beforeAll(async () => {
    team = await createTeam(t);
    const projectId = (await newProject(team.as.ann)).id;
    const res = await team.as.ann.agent
      .post(team.as.ann.url('/worksheets'))
      .set('x-csrf-token', team.as.ann.csrf)
      .set('user-agent', hostileAgent)
      .send({ projectId, ...dividerDraft(), title });
    expect(res.status).toBe(201);
    worksheetId = (res.body as { id: string }).id;
    await newWorksheet(team.as.ann, projectId, { ...dividerDraft(), title: 'Other' });
  });
  afterAll(() => t.close());

  it('when a manager exports, then every matching row comes as an attachment with a dated name, a header row, RFC 4180 quoting and formulas neutralized, and the export is audited', async () => {
    const listed = await team.as.max.get(`/audit?worksheet=${worksheetId}`);

    const res = await team.as.max.get(`/audit/export.csv?worksheet=${worksheetId}&limit=1`);

    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('text/csv; charset=utf-8');
    const day = new Date().toISOString().slice(0, 10);
    expect(res.headers['content-disposition']).toBe(
      `attachment; filename=audit-${team.org.slug}-${day}.csv`,
    );
    expect(res.text.startsWith('\uFEFF')).toBe(true);
    const rows = parseCsv(res.text.slice(1));
    expect(rows[0]).toEqual(header);
    // No paging: `limit` is ignored; the rows are the list's rows, in its order.
    expect(rows.slice(1).map((r) => r[13])).toEqual(
      (listed.body.items as { id: string }[]).map((e) => e.id),
    );
    const created = rows.find((r) => r[3] === 'worksheet.created')!;
    expect(created[4]).toBe(`Created "${title}" revision A`);
    expect(res.text).toContain(`"Created ""Preamp, ""quiet"" input"" revision A"`);
    expect(created[11]).toBe(`'${hostileAgent}`);
    expect(created[1]).toBe('Ann Fixture');
    expect(JSON.parse(created[12]!)).toMatchObject({ title, revision: 'A' });

    const [event] = await systemRows<{ actor_user_id: string; details: object; summary: string }>(
      t,
      `SELECT actor_user_id, details, summary FROM audit_events WHERE org_id = $1 AND action = 'audit.exported'`,
      [team.org.id],
    );
    expect(event).toEqual({
      actor_user_id: team.people.max!.id,
      details: { rows: rows.length - 1, filter: { worksheetId } },
      summary: `Exported ${rows.length - 1} audit events as CSV`,
    });
  });

  it('when filtered by action and time, then the export holds the same rows as the list', async () => {
    const query = 'action=worksheet.created&from=2020-01-01&to=2999-12-31';
    const listed = await team.as.max.get(`/audit?${query}`);

    const res = await team.as.max.get(`/audit/export.csv?${query}`);

    const rows = parseCsv(res.text.slice(1)).slice(1);
    expect(rows).toHaveLength(2);
    expect(rows.map((r) => r[13])).toEqual(
      (listed.body.items as { id: string }[]).map((e) => e.id),
    );
  });

  it('when an author asks for the export, then it answers 403 and records nothing', async () => {
    const before = await systemRows(t, 'SELECT count(*) FROM audit_events WHERE org_id = $1', [
      team.org.id,
    ]);

    const res = await team.as.ann.get('/audit/export.csv');

    expect(res.status).toBe(403);
    expect(
      await systemRows(t, 'SELECT count(*) FROM audit_events WHERE org_id = $1', [team.org.id]),
    ).toEqual(before);
  });

  it.each([
    ['=1+2', "'=1+2"],
    ['+SUM(A1:A9)', "'+SUM(A1:A9)"],
    ['-2+3', "'-2+3"],
    ['@cmd', "'@cmd"],
    ['\tTAB', "'\tTAB"],
    ['a,b', '"a,b"'],
    ['say "hi"', '"say ""hi"""'],
    ['two\nlines', '"two\nlines"'],
    ['=x,"y"', `"'=x,""y"""`],
    ['plain text', 'plain text'],
    [null, ''],
  ])('when a cell is %j, then it is written as %j', (value, written) => {
    expect(csvCell(value)).toBe(written);
  });

  it('when there are no events, then the file is the header row alone', () => {
    expect(auditCsv([])).toBe(`\uFEFF${header.join(',')}\r\n`);
  });
});
