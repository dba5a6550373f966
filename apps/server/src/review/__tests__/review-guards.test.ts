import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp } from '../../test-support/test-app.ts';
import { insertFindingRow, systemRows, TEST_PASSWORD } from '../../test-support/fixtures.ts';
import { orgSnapshot } from '../../test-support/org-routes.ts';
import {
  auditEvents,
  createTeam,
  newProject,
  newWorksheet,
  type OrgApi,
  type Team,
  type WorksheetBody,
} from '../../test-support/team.ts';
import { dividerDraft } from '../../worksheets/__tests__/worksheet-drafts.ts';
import { nextRevisionLetter } from '../../worksheets/guards.ts';

describe('revision letters', () => {
  it.each([
    ['A', 'B'],
    ['Y', 'Z'],
    ['Z', 'AA'],
    ['AZ', 'BA'],
    ['ZZ', 'AAA'],
  ])('when the current revision is %s, then the next is %s', (letter, next) => {
    expect(nextRevisionLetter(letter)).toBe(next);
  });
});

describe('review: guards, separation of duties, frozen revisions and concurrency', () => {
  const t = createTestApp();
  let team: Team;
  let projectId: string;
  beforeAll(async () => {
    team = await createTeam(t);
    projectId = (await newProject(team.as.ann)).id;
  });
  afterAll(() => t.close());

  const id = (name: keyof Team['as']) => team.people[name]!.id;
  const step = (api: OrgApi, ws: { id: string }, body: object) =>
    api.post(`/worksheets/${ws.id}/transitions`, body);

  /** A divider by `author`, with checker and approver assigned, moved to `state` through the API. */
  async function worksheetIn(
    state: 'draft' | 'in_check' | 'checked',
    people: { author?: 'ann' | 'cal'; checker?: 'kim' | 'cal'; approver?: 'abe' | 'cal' } = {},
  ): Promise<WorksheetBody> {
    const author = team.as[people.author ?? 'ann'];
    const checker = team.as[people.checker ?? 'kim'];
    const ws = await newWorksheet(author, projectId, dividerDraft());
    let res = await author.patch(`/worksheets/${ws.id}`, {
      version: 1,
      checkerId: id(people.checker ?? 'kim'),
      approverId: id(people.approver ?? 'abe'),
    });
    if (state !== 'draft') res = await step(author, ws, { action: 'submit', version: 2 });
    if (state === 'checked') res = await step(checker, ws, { action: 'accept', version: 3 });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    return res.body as WorksheetBody;
  }

  /** Runs a refused call and checks that nothing in the organization changed. */
  async function refused(
    call: () => Promise<{ status: number; body: { error?: { code: string; message: string } } }>,
  ) {
    const before = await orgSnapshot(t, team.org.id);
    const res = await call();
    expect(await orgSnapshot(t, team.org.id)).toEqual(before);
    return { status: res.status, code: res.body.error?.code, message: res.body.error?.message };
  }

  it('when a worksheet without a checker or approver is submitted, then it answers 409 assignment-missing and nothing changes', async () => {
    const ws = await newWorksheet(team.as.ann, projectId, dividerDraft());
    expect(await refused(() => step(team.as.ann, ws, { action: 'submit', version: 1 }))).toEqual({
      status: 409,
      code: 'assignment-missing',
      message: 'Assign a checker and an approver before submitting this worksheet.',
    });
  });

  it('when people act outside their role, then each attempt answers 403 and nothing changes', async () => {
    const draft = await worksheetIn('draft');
    const inCheck = await worksheetIn('in_check');
    const checked = await worksheetIn('checked');
    const attempts = [
      [team.as.bob, draft, 'submit', 'Only the author of this worksheet may do this.'],
      [team.as.kim, draft, 'submit', 'Only the author of this worksheet may do this.'],
      [team.as.abe, inCheck, 'accept', 'Only a checker may do this.'],
      [team.as.cal, inCheck, 'accept', 'Only the assigned checker may do this.'],
      [team.as.kim, checked, 'sign', 'Only an approver may do this.'],
      [team.as.cal, checked, 'sign', 'Only the assigned approver may do this.'],
      [team.as.max, inCheck, 'withdraw', 'Only the author of this worksheet may do this.'],
    ] as const;
    for (const [api, ws, action, message] of attempts) {
      const body = { action, version: ws.version, meaning: 'Reviewed', password: TEST_PASSWORD };
      expect(await refused(() => step(api, ws, body))).toEqual({
        status: 403,
        code: 'forbidden',
        message,
      });
    }
  });

  it('when the author holds every review role, then they can neither check nor sign their own worksheet', async () => {
    const own = await worksheetIn('in_check', { author: 'cal', checker: 'kim', approver: 'abe' });
    await systemRows(t, 'UPDATE worksheets SET checker_user_id = $2 WHERE id = $1 RETURNING id', [
      own.id,
      id('cal'),
    ]);
    expect(
      await refused(() => step(team.as.cal, own, { action: 'accept', version: own.version })),
    ).toMatchObject({
      status: 403,
      message: 'Nobody checks a revision they authored.',
    });
    expect(
      await refused(() =>
        team.as.cal.post(`/worksheets/${own.id}/findings`, {
          path: 'nodes.out',
          severity: 'note',
          text: 'Mine',
        }),
      ),
    ).toMatchObject({ status: 403, code: 'forbidden' });
  });

  it('when the checker who accepted a revision is also its approver, then signing answers 403', async () => {
    const ws = await worksheetIn('in_check', { checker: 'cal', approver: 'abe' });
    expect((await step(team.as.cal, ws, { action: 'accept', version: ws.version })).status).toBe(
      200,
    );
    // The approver is changed to the person who accepted (an assignment after the fact).
    await systemRows(t, 'UPDATE worksheets SET approver_user_id = $2 WHERE id = $1 RETURNING id', [
      ws.id,
      id('cal'),
    ]);
    const body = {
      action: 'sign',
      version: ws.version + 1,
      meaning: 'Reviewed',
      password: TEST_PASSWORD,
    };
    expect(await refused(() => step(team.as.cal, ws, body))).toMatchObject({
      status: 403,
      message: 'The checker of a revision cannot also sign it off.',
    });
  });

  it('when an action does not start from the current state, or a major finding is open, then it answers 409 and nothing changes', async () => {
    const draft = await worksheetIn('draft');
    const checked = await worksheetIn('checked');
    expect(
      await refused(() => step(team.as.kim, draft, { action: 'accept', version: draft.version })),
    ).toMatchObject({
      status: 409,
      code: 'invalid-transition',
    });
    await insertFindingRow(t, {
      orgId: team.org.id,
      worksheetId: checked.id,
      createdById: id('kim'),
      severity: 'major',
      status: 'answered',
    });
    const sign = {
      action: 'sign',
      version: checked.version,
      meaning: 'Reviewed',
      password: TEST_PASSWORD,
    };
    expect(await refused(() => step(team.as.abe, checked, sign))).toMatchObject({
      status: 409,
      code: 'open-findings',
      message: '1 major finding is still open; close them before accepting or signing off.',
    });
  });

  it('when a signature meaning is not in the organization’s list, or the password is missing, then it answers 400 and nothing changes', async () => {
    const checked = await worksheetIn('checked');
    const base = { action: 'sign', version: checked.version };
    const unknown = await refused(() =>
      step(team.as.abe, checked, { ...base, meaning: 'Looks fine', password: TEST_PASSWORD }),
    );
    expect(unknown).toMatchObject({ status: 400, code: 'validation-failed' });
    const missing = await refused(() =>
      step(team.as.abe, checked, { ...base, meaning: 'Reviewed' }),
    );
    expect(missing).toMatchObject({ status: 400 });
  });

  it('when the organization lists its own signature meanings, then only those are accepted', async () => {
    await systemRows(
      t,
      `UPDATE organizations SET settings = settings || '{"signatureMeanings":["Verified by test"]}' WHERE id = $1 RETURNING id`,
      [team.org.id],
    );
    try {
      const checked = await worksheetIn('checked');
      const base = { action: 'sign', version: checked.version, password: TEST_PASSWORD };
      expect((await step(team.as.abe, checked, { ...base, meaning: 'Reviewed' })).status).toBe(400);
      const ok = await step(team.as.abe, checked, { ...base, meaning: 'Verified by test' });
      expect(ok.status).toBe(200);
    } finally {
      await systemRows(
        t,
        `UPDATE organizations SET settings = settings - 'signatureMeanings' WHERE id = $1 RETURNING id`,
        [team.org.id],
      );
    }
  });

  it('when a transition carries a stale version, then it answers 409 stale-version and nothing changes', async () => {
    const ws = await worksheetIn('draft');
    expect(
      await refused(() => step(team.as.ann, ws, { action: 'submit', version: 1 })),
    ).toMatchObject({
      status: 409,
      code: 'stale-version',
    });
  });

  it('when a frozen revision is changed or deleted by direct SQL, then the database refuses it', async () => {
    const ws = await worksheetIn('in_check');
    await expect(
      systemRows(
        t,
        `UPDATE revisions SET circuit = '{}'::jsonb WHERE worksheet_id = $1 RETURNING id`,
        [ws.id],
      ),
    ).rejects.toThrow(/frozen/);
    await expect(
      systemRows(t, 'DELETE FROM revisions WHERE worksheet_id = $1 RETURNING id', [ws.id]),
    ).rejects.toThrow(/frozen/);
    const [row] = await systemRows<{ content_hash: string; frozen: boolean }>(
      t,
      'SELECT content_hash, frozen FROM revisions WHERE worksheet_id = $1',
      [ws.id],
    );
    expect(row).toEqual({ content_hash: ws.currentRevision.contentHash, frozen: true });
  });

  it('when a signature is changed by direct SQL, then the database refuses it', async () => {
    const checked = await worksheetIn('checked');
    const signed = await step(team.as.abe, checked, {
      action: 'sign',
      version: checked.version,
      meaning: 'Reviewed',
      password: TEST_PASSWORD,
    });
    expect(signed.status).toBe(200);
    await expect(
      systemRows(
        t,
        `UPDATE signatures SET meaning = 'Approved for release' WHERE worksheet_id = $1 RETURNING id`,
        [checked.id],
      ),
    ).rejects.toThrow(/cannot be changed/);
    await expect(
      systemRows(t, 'DELETE FROM signatures WHERE worksheet_id = $1 RETURNING id', [checked.id]),
    ).rejects.toThrow(/cannot be changed/);
  });

  it('when a later revision of a signed worksheet is signed, then the earlier signature is marked superseded', async () => {
    const checked = await worksheetIn('checked');
    // An earlier signature of revision A, as if A had been signed before B was made.
    const [earlier] = await systemRows<{ id: string }>(
      t,
      `INSERT INTO signatures (org_id, worksheet_id, revision_letter, user_id, printed_name, meaning, content_hash, signed_at)
       VALUES ($1, $2, 'A', $3, 'Abe Fixture', 'Reviewed', $4, now() - interval '1 day') RETURNING id`,
      [team.org.id, checked.id, id('abe'), checked.currentRevision.contentHash],
    );
    const signed = await step(team.as.abe, checked, {
      action: 'sign',
      version: checked.version,
      meaning: 'Reviewed',
      password: TEST_PASSWORD,
    });
    expect(signed.status).toBe(200);
    const rows = await systemRows<{ id: string; superseded_at: Date | null }>(
      t,
      'SELECT id, superseded_at FROM signatures WHERE worksheet_id = $1 ORDER BY signed_at',
      [checked.id],
    );
    expect(rows.map((r) => [r.id === earlier!.id, r.superseded_at !== null])).toEqual([
      [true, true],
      [false, false],
    ]);
  });

  it('when two transitions on one worksheet race, then exactly one wins, the other answers 409, and one audit event is written', async () => {
    const ws = await worksheetIn('in_check');
    const [a, b] = await Promise.all([
      step(team.as.kim, ws, { action: 'accept', version: ws.version }),
      step(team.as.kim, ws, { action: 'return', version: ws.version }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const events = (await auditEvents(t, team.org.id, 'worksheet.accepted'))
      .concat(await auditEvents(t, team.org.id, 'worksheet.returned'))
      .filter((e) => e.target_id === ws.id);
    expect(events).toHaveLength(1);
    const [row] = await systemRows<{ state: string; version: number }>(
      t,
      'SELECT state, version FROM worksheets WHERE id = $1',
      [ws.id],
    );
    expect(row).toEqual({
      state: a.status === 200 ? 'checked' : 'returned',
      version: ws.version + 1,
    });
  });

  it('when the author withdraws a worksheet in check, then it is withdrawn and can no longer be submitted', async () => {
    const ws = await worksheetIn('in_check');
    const res = await step(team.as.ann, ws, { action: 'withdraw', version: ws.version });
    expect(res.body).toMatchObject({ state: 'withdrawn' });
    expect(
      await refused(() => step(team.as.ann, ws, { action: 'submit', version: ws.version + 1 })),
    ).toMatchObject({
      status: 409,
      code: 'invalid-transition',
    });
  });

  it('when findings move out of order or by the wrong person, then each attempt is refused and nothing changes', async () => {
    const ws = await worksheetIn('in_check');
    const raised = await team.as.kim.post(`/worksheets/${ws.id}/findings`, {
      path: 'devices.r2.p',
      severity: 'minor',
      text: 'Check the rating.',
    });
    expect(raised.status).toBe(201);
    const f = raised.body.id as string;
    expect(
      await refused(() => team.as.kim.post(`/findings/${f}/answer`, { text: 'x' })),
    ).toMatchObject({ status: 403 });
    expect(
      await refused(() => team.as.bob.post(`/findings/${f}/answer`, { text: 'x' })),
    ).toMatchObject({ status: 403 });
    expect(await refused(() => team.as.ann.post(`/findings/${f}/close`, {}))).toMatchObject({
      status: 403,
    });
    expect(await refused(() => team.as.kim.post(`/findings/${f}/reopen`, {}))).toMatchObject({
      status: 409,
      code: 'conflict',
    });
    expect(
      await refused(() => team.as.ann.post(`/findings/${f}/answer`, { text: '' })),
    ).toMatchObject({ status: 400 });
    const draft = await worksheetIn('draft');
    expect(
      await refused(() =>
        team.as.kim.post(`/worksheets/${draft.id}/findings`, {
          path: 'nodes.out',
          severity: 'major',
          text: 'Early',
        }),
      ),
    ).toMatchObject({ status: 409 });
    expect(
      await refused(() =>
        team.as.kim.post(`/worksheets/${ws.id}/findings`, {
          path: 'nodes..out',
          severity: 'fatal',
          text: '',
        }),
      ),
    ).toMatchObject({ status: 400, code: 'validation-failed' });
  });

  it('when the approver enters five wrong signing passwords, then the sixth attempt answers 429 even with the right password, and nothing is signed', async () => {
    const ws = await worksheetIn('checked');
    const sign = (password: string) =>
      step(team.as.abe, ws, { action: 'sign', version: ws.version, meaning: 'Reviewed', password });
    for (let i = 0; i < 5; i++) {
      expect((await sign(`wrong-${i}`)).body.error.code).toBe('bad-password');
    }
    const before = await orgSnapshot(t, team.org.id);

    const paused = await sign(TEST_PASSWORD);

    expect(paused.status).toBe(429);
    expect(paused.body.error.message).toMatch(/Too many wrong passwords when signing/);
    expect(await orgSnapshot(t, team.org.id)).toEqual(before);
    const [row] = await systemRows<{ state: string }>(
      t,
      'SELECT state FROM worksheets WHERE id = $1',
      [ws.id],
    );
    expect(row?.state).toBe('checked');
  });
});
