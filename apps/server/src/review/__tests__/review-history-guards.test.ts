import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { queueResponseSchema, revisionHistorySchema } from '@biasproof/shared';
import { createTestApp } from '../../test-support/test-app.ts';
import { insertWorksheetRow, systemRows, TEST_PASSWORD } from '../../test-support/fixtures.ts';
import { absentId, orgSnapshot } from '../../test-support/org-routes.ts';
import {
  auditEvents,
  createTeam,
  expectShape,
  newProject,
  newWorksheet,
  type OrgApi,
  type Team,
  type TeamMember,
  type WorksheetBody,
} from '../../test-support/team.ts';
import { dividerDraft } from '../../worksheets/__tests__/worksheet-drafts.ts';

type Reply = { status: number; body: { error?: { code: string; message: string } } };

describe('review history: guards of revise, replies, revision states and the queue', () => {
  const t = createTestApp();
  let team: Team;
  let projectId: string;
  beforeAll(async () => {
    team = await createTeam(t);
    projectId = (await newProject(team.as.ann)).id;
  });
  afterAll(() => t.close());

  const id = (name: TeamMember) => team.people[name]!.id;
  const step = (api: OrgApi, ws: { id: string }, body: object) =>
    api.post(`/worksheets/${ws.id}/transitions`, body);

  /** A divider by ann (kim checks, abe signs) moved through the API to `state`. */
  async function worksheetIn(
    state: 'draft' | 'in_check' | 'checked' | 'returned' | 'signed_off',
  ): Promise<WorksheetBody> {
    const { ann, kim, abe } = team.as;
    const ws = await newWorksheet(ann, projectId, { ...dividerDraft(), title: `In ${state}` });
    let res = await ann.patch(`/worksheets/${ws.id}`, {
      version: 1,
      checkerId: id('kim'),
      approverId: id('abe'),
    });
    const moves: [OrgApi, object][] = [
      [ann, { action: 'submit', version: 2 }],
      [
        kim,
        state === 'returned' ? { action: 'return', version: 3 } : { action: 'accept', version: 3 },
      ],
      [abe, { action: 'sign', version: 4, meaning: 'Reviewed', password: TEST_PASSWORD }],
    ];
    const count = { draft: 0, in_check: 1, returned: 2, checked: 2, signed_off: 3 }[state];
    for (const [api, body] of moves.slice(0, count)) res = await step(api, ws, body);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    return res.body as WorksheetBody;
  }

  /** Everything a refused call must leave alone: the organization, revision states, replies, outbox. */
  const snapshot = async () => ({
    org: await orgSnapshot(t, team.org.id),
    revisions: await systemRows(
      t,
      'SELECT worksheet_id, letter, state, submitted_at FROM revisions WHERE org_id = $1 ORDER BY worksheet_id, letter',
      [team.org.id],
    ),
    replies: await systemRows(t, 'SELECT id FROM finding_replies WHERE org_id = $1 ORDER BY id', [
      team.org.id,
    ]),
    outbox: await systemRows(t, 'SELECT id FROM outbox_messages WHERE org_id = $1 ORDER BY id', [
      team.org.id,
    ]),
  });
  async function refused(call: () => Promise<Reply>) {
    const before = await snapshot();
    const res = await call();
    expect(await snapshot()).toEqual(before);
    return [res.status, res.body.error?.code, res.body.error?.message];
  }

  it('when anyone but its author revises a signed worksheet, then it answers 403 and nothing changes', async () => {
    const ws = await worksheetIn('signed_off');
    for (const who of ['kim', 'abe', 'bob', 'max', 'ada'] as const) {
      expect(await refused(() => step(team.as[who], ws, { action: 'revise', version: 5 }))).toEqual(
        [403, 'forbidden', 'Only the author of this worksheet may do this.'],
      );
    }
  });

  it('when a worksheet that is not signed off is revised, or the version is stale, then it answers 409 and nothing changes', async () => {
    for (const state of ['draft', 'in_check', 'checked', 'returned'] as const) {
      const ws = await worksheetIn(state);
      expect(
        await refused(() => step(team.as.ann, ws, { action: 'revise', version: ws.version })),
      ).toEqual([
        409,
        'invalid-transition',
        `This worksheet is ${state.replace('_', ' ')}; revise is possible only from signed off.`,
      ]);
    }
    const signed = await worksheetIn('signed_off');
    const [status, code] = await refused(() =>
      step(team.as.ann, signed, { action: 'revise', version: 4 }),
    );
    expect([status, code]).toEqual([409, 'stale-version']);
  });

  it('when a viewer, an author of another worksheet, an empty reply or an unknown finding is sent, then the reply is refused and nothing changes', async () => {
    const ws = await worksheetIn('in_check');
    const raised = await team.as.kim.post(`/worksheets/${ws.id}/findings`, {
      path: 'nodes.out',
      severity: 'minor',
      text: 'Check the load.',
    });
    const reply = (api: OrgApi, findingId: string, body: object) =>
      api.post(`/findings/${findingId}/replies`, body);
    const fid = raised.body.id as string;
    const text = { text: 'A reply.' };
    const roles = 'Your roles in this organization do not allow this.';
    expect(await refused(() => reply(team.as.max, fid, text))).toEqual([403, 'forbidden', roles]);
    expect(await refused(() => reply(team.as.ada, fid, text))).toEqual([403, 'forbidden', roles]);
    expect(await refused(() => reply(team.as.bob, fid, text))).toEqual([
      403,
      'forbidden',
      'Only the author of the worksheet, a checker or an approver may reply to this finding.',
    ]);
    expect((await refused(() => reply(team.as.kim, fid, { text: '  ' }))).slice(0, 2)).toEqual([
      400,
      'validation-failed',
    ]);
    expect((await refused(() => reply(team.as.kim, absentId(), text))).slice(0, 2)).toEqual([
      404,
      'not-found',
    ]);
    expect((await refused(() => reply(team.as.kim, 'not-an-id', text))).slice(0, 2)).toEqual([
      404,
      'not-found',
    ]);
  });

  it('when a checker replies, then the reply is stored as kind reply, the status stays and one audit event is written', async () => {
    const ws = await worksheetIn('in_check');
    const raised = await team.as.kim.post(`/worksheets/${ws.id}/findings`, {
      path: 'elements.r1.value',
      severity: 'note',
      text: 'Why 1 kΩ?',
    });
    const fid = raised.body.id as string;
    const res = await team.as.kim.post(`/findings/${fid}/replies`, {
      text: 'For the bias current.',
    });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'open', replies: [{ kind: 'reply' }] });
    expect(
      await systemRows(
        t,
        'SELECT kind, text, created_by_user_id FROM finding_replies WHERE finding_id = $1',
        [fid],
      ),
    ).toEqual([{ kind: 'reply', text: 'For the bias current.', created_by_user_id: id('kim') }]);
    const [finding] = await systemRows(t, 'SELECT status FROM findings WHERE id = $1', [fid]);
    expect(finding).toEqual({ status: 'open' });
    const events = (await auditEvents(t, team.org.id, 'finding.replied')).filter(
      (e) => e.target_id === fid,
    );
    expect(events).toMatchObject([{ actor_user_id: id('kim'), details: { status: 'open' } }]);
    const [event] = await systemRows(
      t,
      `SELECT summary, revision, worksheet_id FROM audit_events
        WHERE org_id = $1 AND action = 'finding.replied' AND target_id = $2`,
      [team.org.id, fid],
    );
    expect(event).toEqual({
      summary: 'Replied on the note finding on elements.r1.value of "In in_check" revision A',
      revision: 'A',
      worksheet_id: ws.id,
    });
  });

  it('when the state of a frozen revision is changed by direct SQL, then it is let through, and any content change is still refused', async () => {
    const ws = await worksheetIn('in_check');
    const sql = (set: string) =>
      systemRows(t, `UPDATE revisions SET ${set} WHERE worksheet_id = $1 RETURNING letter`, [
        ws.id,
      ]);
    await expect(sql("state = 'withdrawn'")).resolves.toEqual([{ letter: 'A' }]);
    await expect(sql("state = 'in_check', content_hash = repeat('0', 64)")).rejects.toThrow(
      /is frozen/,
    );
    await expect(sql('submitted_at = now()')).rejects.toThrow(/is frozen/);
    await expect(
      systemRows(t, 'DELETE FROM revisions WHERE worksheet_id = $1', [ws.id]),
    ).rejects.toThrow(/is frozen/);
  });

  it('when a revision letter is unknown or malformed, then it answers 404; a diff with a bad query answers 400; nothing changes', async () => {
    const ws = await worksheetIn('draft');
    const get = (path: string) => refused(() => team.as.max.get(`/worksheets/${ws.id}${path}`));
    expect(await get('/revisions/B')).toEqual([
      404,
      'not-found',
      'This worksheet has no revision B.',
    ]);
    expect((await get('/revisions/a')).slice(0, 2)).toEqual([404, 'not-found']);
    expect((await get('/diff?from=A&to=C')).slice(0, 2)).toEqual([404, 'not-found']);
    expect((await get('/diff?from=A')).slice(0, 2)).toEqual([400, 'validation-failed']);
    expect((await get('/diff?from=1&to=A')).slice(0, 2)).toEqual([400, 'validation-failed']);
    const history = await team.as.max.get(`/worksheets/${ws.id}/revisions`);
    expectShape(revisionHistorySchema, history.body);
    expect(history.body.items).toMatchObject([
      {
        letter: 'A',
        state: 'draft',
        frozen: false,
        submittedAt: null,
        findingCount: 0,
        signatures: [],
      },
    ]);
  });

  it('when members open their queue, then each list holds the worksheets waiting for them, and signatures older than 30 days drop out', async () => {
    const inCheck = await worksheetIn('in_check');
    const checked = await worksheetIn('checked');
    const returned = await worksheetIn('returned');
    const signed = await worksheetIn('signed_off');
    const oldSigned = await insertWorksheetRow(t, {
      orgId: team.org.id,
      projectId,
      authorId: id('ann'),
      checkerId: id('kim'),
      approverId: id('abe'),
      state: 'signed_off',
      frozen: true,
    });
    await systemRows(
      t,
      `INSERT INTO signatures (org_id, worksheet_id, revision_letter, user_id, printed_name, meaning, content_hash, signed_at)
       SELECT org_id, worksheet_id, 'A', $2, 'Abe Fixture', 'Reviewed', content_hash, now() - interval '31 days'
         FROM revisions WHERE worksheet_id = $1 RETURNING id`,
      [oldSigned, id('abe')],
    );
    const queue = async (who: TeamMember) => {
      const res = await team.as[who].get('/queue');
      expect(res.status).toBe(200);
      expectShape(queueResponseSchema, res.body);
      const q = queueResponseSchema.parse(res.body);
      return Object.fromEntries(
        Object.entries(q).map(([list, items]) => [
          list,
          [inCheck, checked, returned, signed]
            .map((w) => w.id)
            .concat(oldSigned)
            .filter((wid) => items.some((i) => i.id === wid)),
        ]),
      );
    };
    expect(await queue('kim')).toEqual({
      toCheck: [inCheck.id],
      toSign: [],
      returnedToMe: [],
      recentlySigned: [signed.id],
    });
    expect(await queue('abe')).toEqual({
      toCheck: [],
      toSign: [checked.id],
      returnedToMe: [],
      recentlySigned: [signed.id],
    });
    expect(await queue('ann')).toEqual({
      toCheck: [],
      toSign: [],
      returnedToMe: [returned.id],
      recentlySigned: [signed.id],
    });
    const bob = queueResponseSchema.parse((await team.as.bob.get('/queue')).body);
    expect(bob).toEqual({ toCheck: [], toSign: [], returnedToMe: [], recentlySigned: [] });
  });
});
