import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  availableActionsResponseSchema,
  findingSchema,
  signatureListSchema,
  worksheetSchema,
} from '@biasproof/shared';
import { createTestApp } from '../../test-support/test-app.ts';
import { systemRows, TEST_PASSWORD } from '../../test-support/fixtures.ts';
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
import { dividerDraft, dividerWithR2 } from '../../worksheets/__tests__/worksheet-drafts.ts';

describe('review: the whole path from submission to signature', () => {
  const t = createTestApp();
  let team: Team;
  let projectId: string;
  beforeAll(async () => {
    team = await createTeam(t);
    projectId = (await newProject(team.as.ann)).id;
  });
  afterAll(() => t.close());

  it('when the author submits, the checker returns with a major finding, the author answers and revises, the checker closes and accepts, and the approver signs, then every step is stored and audited', async () => {
    const { ann, kim, abe, max } = team.as;
    const ws = await newWorksheet(ann, projectId, dividerDraft());
    const assigned = await ann.patch(`/worksheets/${ws.id}`, {
      version: 1,
      checkerId: team.people.kim!.id,
      approverId: team.people.abe!.id,
    });
    expect(assigned.status).toBe(200);
    const step = (api: typeof ann, body: object) =>
      api.post(`/worksheets/${ws.id}/transitions`, body);

    // 1. The author submits: revision A is recomputed, frozen and in check.
    const submitted = await step(ann, { action: 'submit', version: 2 });
    expect(submitted.status, JSON.stringify(submitted.body)).toBe(200);
    expectShape(worksheetSchema, submitted.body);
    expect(submitted.body).toMatchObject({ state: 'in_check', version: 3, revision: 'A' });
    expect(submitted.body.currentRevision.frozen).toBe(true);
    const hashA = submitted.body.currentRevision.contentHash as string;
    expect((await storedWorksheet(t, ws.id)).revisions).toMatchObject([
      { letter: 'A', frozen: true, content_hash: hashA },
    ]);

    // 2. The checker pins a major finding on a number and returns the worksheet.
    const raised = await kim.post(`/worksheets/${ws.id}/findings`, {
      path: 'nodes.out',
      severity: 'major',
      text: 'The output sits at half the supply; the spec asks for 2.0 V.',
    });
    expect(raised.status, JSON.stringify(raised.body)).toBe(201);
    expectShape(findingSchema, raised.body);
    expect(raised.body).toMatchObject({
      revision: 'A',
      path: 'nodes.out',
      severity: 'major',
      status: 'open',
    });
    const findingId = raised.body.id as string;
    const acceptTooEarly = await step(kim, { action: 'accept', version: 3 });
    expect(acceptTooEarly.status).toBe(409);
    expect(acceptTooEarly.body.error.code).toBe('open-findings');
    const returned = await step(kim, { action: 'return', version: 3, comment: 'See the finding.' });
    expect(returned.status).toBe(200);
    expect(returned.body).toMatchObject({ state: 'returned', version: 4 });

    // 3. The author answers and edits: the edit starts revision B; A stays frozen as it was.
    const answered = await ann.post(`/findings/${findingId}/answer`, { text: 'R2 is now 660 Ω.' });
    expect(answered.status).toBe(200);
    expect(answered.body).toMatchObject({
      status: 'answered',
      replies: [{ kind: 'answer', text: 'R2 is now 660 Ω.' }],
    });
    const edited = await ann.patch(`/worksheets/${ws.id}`, {
      version: 4,
      circuit: dividerWithR2(660),
    });
    expect(edited.status, JSON.stringify(edited.body)).toBe(200);
    expect(edited.body).toMatchObject({ revision: 'B', state: 'returned', version: 5 });
    expect(edited.body.currentRevision.frozen).toBe(false);
    const afterEdit = await storedWorksheet(t, ws.id);
    expect(afterEdit.revisions.map((r) => [r.letter, r.frozen, r.content_hash === hashA])).toEqual([
      ['A', true, true],
      ['B', false, false],
    ]);
    const resubmitted = await step(ann, { action: 'submit', version: 5 });
    expect(resubmitted.body).toMatchObject({ state: 'in_check', revision: 'B', version: 6 });
    const hashB = resubmitted.body.currentRevision.contentHash as string;

    // 4. The checker closes the finding and accepts.
    const closed = await kim.post(`/findings/${findingId}/close`, { text: 'Confirmed.' });
    expect(closed.body).toMatchObject({ status: 'closed' });
    const accepted = await step(kim, { action: 'accept', version: 6 });
    expect(accepted.status).toBe(200);
    expect(accepted.body).toMatchObject({ state: 'checked', version: 7 });

    // 5. The approver signs: a wrong password first (refused, audited, nothing changes), then theirs.
    const actions = await abe.get(`/worksheets/${ws.id}/actions`);
    expectShape(availableActionsResponseSchema, actions.body);
    const verdicts = availableActionsResponseSchema.parse(actions.body).items;
    expect(verdicts.filter((a) => a.allowed).map((a) => a.action)).toEqual(['return', 'sign']);
    expect(actions.body.signatureMeanings).toEqual(['Reviewed', 'Approved for release']);
    const before = await orgSnapshot(t, team.org.id);
    const wrong = await step(abe, {
      action: 'sign',
      version: 7,
      meaning: 'Approved for release',
      password: 'not-my-password',
    });
    expect(wrong.status).toBe(403);
    expect(wrong.body.error.code).toBe('bad-password');
    const { auditHead: _h1, ...unchangedBefore } = before;
    const { auditHead: _h2, ...unchangedAfter } = await orgSnapshot(t, team.org.id);
    expect(unchangedAfter).toEqual(unchangedBefore);
    expect(await auditEvents(t, team.org.id, 'worksheet.signature-refused')).toMatchObject([
      {
        actor_user_id: team.people.abe!.id,
        target_id: ws.id,
        details: { revision: 'B', reason: 'bad-password' },
      },
    ]);

    const signed = await step(abe, {
      action: 'sign',
      version: 7,
      meaning: 'Approved for release',
      password: TEST_PASSWORD,
    });
    expect(signed.status, JSON.stringify(signed.body)).toBe(200);
    expect(signed.body).toMatchObject({ state: 'signed_off', revision: 'B', version: 8 });
    const signatures = await max.get(`/worksheets/${ws.id}/signatures`);
    expectShape(signatureListSchema, signatures.body);
    expect(signatures.body).toMatchObject({
      total: 1,
      items: [
        {
          revision: 'B',
          signer: { id: team.people.abe!.id },
          printedName: team.people.abe!.name,
          meaning: 'Approved for release',
          contentHash: hashB,
          supersededAt: null,
        },
      ],
    });
    const [stored] = await systemRows<{ signed_at: Date; content_hash: string }>(
      t,
      'SELECT signed_at, content_hash FROM signatures WHERE worksheet_id = $1',
      [ws.id],
    );
    expect(stored?.content_hash).toBe(hashB);
    expect(Math.abs(new Date(stored!.signed_at).getTime() - Date.now())).toBeLessThan(60_000);

    // One audit event per transition, with from/to state and revision letter.
    const trail = await systemRows<{ action: string; details: Record<string, unknown> }>(
      t,
      `SELECT action, details FROM audit_events WHERE org_id = $1 AND target_id = $2
          AND action LIKE 'worksheet.%' AND action NOT IN ('worksheet.created', 'worksheet.assigned', 'worksheet.updated')
        ORDER BY seq`,
      [team.org.id, ws.id],
    );
    expect(trail.map((e) => [e.action, e.details.from, e.details.to, e.details.revision])).toEqual([
      ['worksheet.submitted', 'draft', 'in_check', 'A'],
      ['worksheet.returned', 'in_check', 'returned', 'A'],
      ['worksheet.submitted', 'returned', 'in_check', 'B'],
      ['worksheet.accepted', 'in_check', 'checked', 'B'],
      ['worksheet.signature-refused', undefined, undefined, 'B'],
      ['worksheet.signed', 'checked', 'signed_off', 'B'],
    ]);
    expect(trail.at(-1)?.details).toMatchObject({
      meaning: 'Approved for release',
      contentHash: hashB,
    });
    expect((await auditEvents(t, team.org.id, 'finding.closed')).map((e) => e.target_id)).toEqual([
      findingId,
    ]);
    const verify = await max.get('/audit/verify');
    expect(verify.body).toMatchObject({ ok: true });
  });
});
