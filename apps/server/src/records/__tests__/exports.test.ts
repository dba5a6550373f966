import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { decodeResults } from '@biasproof/shared';
import { createTestApp } from '../../test-support/test-app.ts';
import { createTeam, newProject, newWorksheet, type Team } from '../../test-support/team.ts';
import { systemRows } from '../../test-support/fixtures.ts';
import { amplifierDraft } from '../sample-record.ts';
import { signedAmplifier, type SignedWorksheet } from './record-steps.ts';

/** Splits RFC 4180 text into rows of fields (quoted fields may hold commas, quotes and line breaks). */
function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let field = '';
  let quoted = false;
  const body = text.replace(/^\uFEFF/, '');
  const endField = () => {
    row.push(field);
    field = '';
  };
  for (let i = 0; i < body.length; i++) {
    const c = body[i]!;
    if (quoted && c === '"' && body[i + 1] === '"') {
      field += '"';
      i++;
    } else if (quoted && c === '"') quoted = false;
    else if (quoted) field += c;
    else if (c === '"') quoted = true;
    else if (c === ',') endField();
    else if (c === '\r' && body[i + 1] === '\n') {
      endField();
      rows.push(row);
      row = [];
      i++;
    } else field += c;
  }
  return rows;
}

describe('CSV exports', () => {
  const t = createTestApp();
  let team: Team;
  let ws: SignedWorksheet;
  beforeAll(async () => {
    team = await createTeam(t);
    ws = await signedAmplifier(team);
  });
  afterAll(() => t.close());

  it('when the bias, devices, small-signal and sweep tables are exported, then each holds the stored numbers at full precision', async () => {
    const [stored] = await systemRows<{ results: unknown }>(
      t,
      'SELECT results FROM revisions WHERE worksheet_id = $1',
      [ws.id],
    );
    const results = decodeResults(stored!.results);
    if (results.status !== 'solved' || !results.sweep.ok || !results.smallSignal.ok)
      throw new Error('the amplifier must solve');
    const table = async (name: string) => {
      const res = await team.as.bob.get(
        `/worksheets/${ws.id}/revisions/A/results.csv?table=${name}`,
      );
      expect(res.status, name).toBe(200);
      expect(res.headers['content-type']).toBe('text/csv; charset=utf-8; header=present');
      expect(res.text.startsWith('\uFEFF')).toBe(true);
      expect(res.text.endsWith('\r\n')).toBe(true);
      return parseCsv(res.text);
    };

    const bias = await table('bias');
    expect(bias[0]).toEqual(['Kind', 'Name', 'Voltage (V)', 'Current (A)', 'Power (W)']);
    expect(bias).toContainEqual(['node', 'c1', String(results.bias.nodes.c1), '', '']);
    expect(bias.at(-1)).toEqual(['circuit', 'supply', '', '', String(results.bias.supplyPower)]);
    const devices = await table('devices');
    expect(devices[0]).toContain('rπ (Ω)');
    const q1 = results.bias.devices.q1!;
    if (q1.kind !== 'Q') throw new Error('q1 is a BJT');
    expect(devices.find((r) => r[0] === 'q1')!.slice(0, 6)).toEqual([
      'q1',
      'Q',
      'NPN',
      'active',
      String(q1.ic),
      String(q1.ib),
    ]);
    const smallSignal = await table('small-signal');
    expect(smallSignal[1]!.slice(0, 4)).toEqual([
      'gain',
      '1000',
      'V/V',
      String(results.smallSignal.value.gain.mag),
    ]);
    const sweep = await table('sweep');
    expect(sweep).toHaveLength(results.sweep.value.freq.length + 1);
    expect(sweep[1]).toEqual([
      String(results.sweep.value.freq[0]),
      String(results.sweep.value.db[0]),
      String(results.sweep.value.deg[0]),
    ]);
  });

  it('when the table is not one of the four, then the answer is 400 naming them', async () => {
    const res = await team.as.bob.get(
      `/worksheets/${ws.id}/revisions/A/results.csv?table=everything`,
    );

    expect(res.status).toBe(400);
    expect(res.body.error.fields.table).toBe('Choose table=bias, devices, small-signal, sweep.');
  });

  it('when the revision has no such results, then the answer is 422 saying why', async () => {
    const project = await newProject(team.as.ann);
    const empty = await newWorksheet(team.as.ann, project.id, { title: 'Empty' });
    const draft = amplifierDraft(1);
    const noInput = await newWorksheet(team.as.ann, project.id, {
      title: 'No input chosen',
      circuit: draft.circuit,
      settings: { ...draft.settings, inputSource: '' },
    });

    const none = await team.as.bob.get(
      `/worksheets/${empty.id}/revisions/A/results.csv?table=bias`,
    );
    const sweep = await team.as.bob.get(
      `/worksheets/${noInput.id}/revisions/A/results.csv?table=sweep`,
    );

    expect([none.status, none.body.error.message]).toEqual([
      422,
      'This revision has no results: the circuit is empty.',
    ]);
    expect([sweep.status, sweep.body.error.message]).toEqual([
      422,
      'This revision has no frequency sweep: Choose the input source in the analysis settings.',
    ]);
  });

  it('when the worksheets list is exported with filters, then every match is a row, text that starts like a formula is neutralized and quoting follows RFC 4180', async () => {
    const project = await newProject(team.as.ann, { name: 'Export, "quoted" project' });
    const nasty = await newWorksheet(team.as.ann, project.id, {
      title: '=HYPERLINK("http://attacker.example","open")',
      description: 'Line one, with a comma\nline two with "quotes"',
    });
    const plain = await newWorksheet(team.as.ann, project.id, {
      title: '@SUM(A1:A9) gain stage',
      ...amplifierDraft(1),
    });
    const other = await newProject(team.as.ann);
    await newWorksheet(team.as.ann, other.id, { title: 'Not in this project' });

    const res = await team.as.max.get(`/worksheets/export.csv?projectId=${project.id}&sort=title`);

    expect(res.status).toBe(200);
    expect(res.headers['content-disposition']).toBe('attachment; filename=worksheets.csv');
    const rows = parseCsv(res.text);
    expect(rows[0]).toEqual([
      'ID',
      'Title',
      'Description',
      'State',
      'Project code',
      'Project',
      'Revision',
      'Version',
      'Author',
      'Checker',
      'Approver',
      'Results',
      'Created (UTC)',
      'Updated (UTC)',
    ]);
    expect(rows.slice(1).map((r) => [r[0], r[1], r[2], r[5]])).toEqual([
      [
        nasty.id,
        `'=HYPERLINK("http://attacker.example","open")`,
        'Line one, with a comma\nline two with "quotes"',
        'Export, "quoted" project',
      ],
      [plain.id, "'@SUM(A1:A9) gain stage", '', 'Export, "quoted" project'],
    ]);
    expect(res.text).toContain(`"'=HYPERLINK(""http://attacker.example"",""open"")"`);
  });

  it('when the export is filtered by state, then only those worksheets are rows', async () => {
    const res = await team.as.max.get('/worksheets/export.csv?state=signed_off');

    expect(res.status).toBe(200);
    expect(
      parseCsv(res.text)
        .slice(1)
        .map((r) => [r[0], r[3]]),
    ).toEqual([[ws.id, 'signed_off']]);
  });

  it('when a filter is not valid, then the answer is 400 and names it', async () => {
    const res = await team.as.max.get('/worksheets/export.csv?state=shipped');

    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('state');
  });
});

describe('records of another organization', () => {
  const t = createTestApp();
  let home: Team;
  let away: Team;
  let ws: SignedWorksheet;
  beforeAll(async () => {
    home = await createTeam(t);
    away = await createTeam(t);
    ws = await signedAmplifier(home);
  });
  afterAll(() => t.close());

  it.each([
    ['report.pdf', 'revisions/A/report.pdf'],
    ['record.zip', 'revisions/A/record.zip'],
    ['results.csv', 'revisions/A/results.csv?table=bias'],
  ])(
    'when a member of another organization asks for the %s, then the answer is 404 whichever organization the path names, and nothing is audited',
    async (_name, rest) => {
      const before = await systemRows(t, 'SELECT count(*) AS n FROM audit_events');
      const underOwn = await away.as.ada.get(`/worksheets/${ws.id}/${rest}`);
      const underTheirs = await away.as.ada.agent.get(
        `/api/orgs/${home.org.id}/worksheets/${ws.id}/${rest}`,
      );

      for (const res of [underOwn, underTheirs]) {
        expect(res.status).toBe(404);
        expect(res.body.error.code).toBe('not-found');
      }
      expect(await systemRows(t, 'SELECT count(*) AS n FROM audit_events')).toEqual(before);
    },
  );

  it('when another organization exports its worksheets list, then none of this organization’s worksheets are in it', async () => {
    const res = await away.as.max.get('/worksheets/export.csv');

    expect(res.status).toBe(200);
    expect(res.text).not.toContain(ws.id);
    expect(parseCsv(res.text)).toHaveLength(1);
  });
});
