import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  findingListSchema,
  findingSchema,
  revisionDetailSchema,
  revisionDiffSchema,
  revisionHistorySchema,
  type DiffEntry,
  type Finding,
} from '@biasproof/shared';
import { createTestApp } from '../../test-support/test-app.ts';
import { systemRows, TEST_PASSWORD } from '../../test-support/fixtures.ts';
import {
  auditEvents,
  createTeam,
  expectShape,
  newProject,
  newWorksheet,
  type OrgApi,
  type Team,
} from '../../test-support/team.ts';
import { dividerDraft, dividerWithR2 } from '../../worksheets/__tests__/worksheet-drafts.ts';
import { drainOutbox, expectDelivered, outboxOf } from './review-mail.ts';

// Reference for every number below: the unloaded 5 V divider, R1 = 1 kΩ over R2,
// Vout = 5·R2/(R1+R2) (Ohm's law), I = 5/(R1+R2); small signal: gain R2/(R1+R2), Zin = R1+R2.
const vout = (r2: number) => (5 * r2) / (1000 + r2);

describe('review and history: the whole path across three revisions', () => {
  const t = createTestApp();
  let team: Team;
  let projectId: string;
  beforeAll(async () => {
    team = await createTeam(t);
    projectId = (await newProject(team.as.ann)).id;
  });
  afterAll(() => t.close());

  const ok = async (call: Promise<{ status: number; body: unknown }>, status = 200) => {
    const res = await call;
    expect(res.status, JSON.stringify(res.body)).toBe(status);
    return res.body as Record<string, unknown>;
  };

  it('when A is returned with a major finding on a number, B is signed, and the signed worksheet is revised and C signed, then findings carry with their numbers, history and diff tell what changed, B is superseded and every e-mail arrives', async () => {
    const { ann, kim, abe } = team.as;
    const ws = await newWorksheet(ann, projectId, { ...dividerDraft(), title: 'Bias divider' });
    const step = (api: OrgApi, body: object) =>
      ok(api.post(`/worksheets/${ws.id}/transitions`, body));
    const findings = async () => {
      const body = await ok(kim.get(`/worksheets/${ws.id}/findings`));
      expectShape(findingListSchema, body);
      return (body as { items: Finding[] }).items;
    };
    await ok(
      ann.patch(`/worksheets/${ws.id}`, {
        version: 1,
        checkerId: id('kim'),
        approverId: id('abe'),
      }),
    );

    // Revision A in check; the checker pins three findings: a result, an input, an unchanged result.
    await step(ann, { action: 'submit', version: 2 });
    const major = await ok(
      kim.post(`/worksheets/${ws.id}/findings`, {
        path: 'nodes.out',
        severity: 'major',
        text: 'The output should sit near 2.0 V.',
      }),
      201,
    );
    expectShape(findingSchema, major);
    expect(major).toMatchObject({
      revision: 'A',
      carried: false,
      pinnedValue: 2.5,
      currentValue: 2.5,
      valueChanged: false,
    });
    const minor = await ok(
      kim.post(`/worksheets/${ws.id}/findings`, {
        path: 'elements.r2.value',
        severity: 'minor',
        text: 'Use an E24 value.',
      }),
      201,
    );
    expect(minor).toMatchObject({ pinnedValue: 1000, currentValue: 1000, valueChanged: false });
    await ok(
      kim.post(`/worksheets/${ws.id}/findings`, {
        path: 'nodes.in',
        severity: 'note',
        text: 'Input straight from the 5 V rail.',
      }),
      201,
    );
    const majorId = major.id as string;

    // The thread: the checker, the author and the approver reply; the status never moves.
    for (const [api, text] of [
      [kim, 'Checker: see the spec, section 4.'],
      [ann, 'Author: which tolerance applies?'],
      [abe, 'Approver: ±5 % is fine for this stage.'],
    ] as const) {
      const reply = await ok(api.post(`/findings/${majorId}/replies`, { text }));
      expect(reply).toMatchObject({ status: 'open' });
      expect((reply.replies as { kind: string; text: string }[]).at(-1)).toMatchObject({
        kind: 'reply',
        text,
      });
    }
    await step(kim, { action: 'return', version: 3, comment: 'See the findings.' });
    await ok(ann.post(`/findings/${majorId}/answer`, { text: 'R2 is now 660 Ω.' }));

    // The author's edit starts B: the findings are carried, marked where the number moved.
    const edited = await ok(
      ann.patch(`/worksheets/${ws.id}`, { version: 4, circuit: dividerWithR2(660) }),
    );
    expect(edited).toMatchObject({ revision: 'B', version: 5 });
    const carried = await findings();
    expect(carried.map((f) => [f.path, f.status, f.carried, f.valueChanged])).toEqual([
      ['nodes.out', 'answered', true, true],
      ['elements.r2.value', 'open', true, true],
      ['nodes.in', 'open', true, false],
    ]);
    expect(carried[0]!.pinnedValue).toBe(2.5);
    expect(carried[0]!.currentValue).toBeCloseTo(vout(660), 12);
    expect(carried[1]).toMatchObject({ pinnedValue: 1000, currentValue: 660 });
    expect(carried[2]).toMatchObject({ pinnedValue: 5, currentValue: 5 });

    // B in check: the carried major finding still blocks until the checker closes it.
    await step(ann, { action: 'submit', version: 5 });
    const blocked = await kim.post(`/worksheets/${ws.id}/transitions`, {
      action: 'accept',
      version: 6,
    });
    expect([blocked.status, blocked.body.error.code]).toEqual([409, 'open-findings']);
    const closed = await ok(kim.post(`/findings/${majorId}/close`, { text: 'Confirmed on B.' }));
    expect(closed).toMatchObject({ status: 'closed', carried: false, valueChanged: true });
    await step(kim, { action: 'accept', version: 6 });
    const signedB = await step(abe, {
      action: 'sign',
      version: 7,
      meaning: 'Reviewed',
      password: TEST_PASSWORD,
    });
    expect(signedB).toMatchObject({ state: 'signed_off', revision: 'B', version: 8 });
    const hashB = (signedB.currentRevision as { contentHash: string }).contentHash;

    // Revise: C is an unfrozen draft copy of B; B stays signed; revising sends no e-mail.
    const mailsBefore = (await outboxOf(t, team.org.id, ws.id)).length;
    const revised = await step(ann, { action: 'revise', version: 8 });
    expect(revised).toMatchObject({ state: 'draft', revision: 'C', version: 9 });
    expect(revised.currentRevision).toMatchObject({ frozen: false, contentHash: hashB });
    expect((await outboxOf(t, team.org.id, ws.id)).length).toBe(mailsBefore);
    expect(await auditEvents(t, team.org.id, 'worksheet.revised')).toMatchObject([
      {
        actor_user_id: id('ann'),
        target_id: ws.id,
        details: { from: 'signed_off', to: 'draft', revision: 'C', startedFrom: 'B', version: 8 },
      },
    ]);
    await ok(ann.patch(`/worksheets/${ws.id}`, { version: 9, circuit: dividerWithR2(680) }));
    await step(ann, { action: 'submit', version: 10 });
    await step(kim, { action: 'accept', version: 11 });
    const signedC = await step(abe, {
      action: 'sign',
      version: 12,
      meaning: 'Approved for release',
      password: TEST_PASSWORD,
    });
    expect(signedC).toMatchObject({ state: 'signed_off', revision: 'C', version: 13 });
    const stillOpen = (await findings()).filter((f) => f.carried);
    expect(stillOpen.map((f) => [f.path, f.revision, f.pinnedValue, f.currentValue])).toEqual([
      ['elements.r2.value', 'A', 1000, 680],
      ['nodes.in', 'A', 5, 5],
    ]);

    // History: every revision with its own state, who/when and its signatures.
    const history = await ok(team.as.max.get(`/worksheets/${ws.id}/revisions`));
    expectShape(revisionHistorySchema, history);
    const items = revisionHistorySchema.parse(history).items;
    expect(
      items.map((r) => [r.letter, r.state, r.frozen, r.findingCount, r.signatures.length]),
    ).toEqual([
      ['A', 'returned', true, 3, 0],
      ['B', 'superseded', true, 0, 1],
      ['C', 'signed_off', true, 0, 1],
    ]);
    expect(items.map((r) => r.createdBy.id)).toEqual([id('ann'), id('ann'), id('ann')]);
    expect(items.every((r) => r.submittedAt !== null)).toBe(true);
    expect(items[1]!.signatures[0]).toMatchObject({ meaning: 'Reviewed', contentHash: hashB });
    expect(items[1]!.signatures[0]!.supersededAt).not.toBeNull();
    expect(items[2]!.signatures[0]).toMatchObject({
      meaning: 'Approved for release',
      supersededAt: null,
    });
    const stored = await systemRows<{ letter: string; state: string }>(
      t,
      'SELECT letter, state FROM revisions WHERE worksheet_id = $1 ORDER BY letter',
      [ws.id],
    );
    expect(stored).toEqual([
      { letter: 'A', state: 'returned' },
      { letter: 'B', state: 'superseded' },
      { letter: 'C', state: 'signed_off' },
    ]);
    expect((await auditEvents(t, team.org.id, 'worksheet.signed')).at(-1)?.details).toMatchObject({
      revision: 'C',
      supersededRevisions: ['B'],
    });

    // One revision in full, and the number-by-number diff A → B.
    const detailA = await ok(kim.get(`/worksheets/${ws.id}/revisions/A`));
    expectShape(revisionDetailSchema, detailA);
    expect(detailA).toMatchObject({ letter: 'A', state: 'returned', frozen: true, signatures: [] });
    expect(valueOf(detailA, 'R2')).toBe(1000);
    const diff = await ok(kim.get(`/worksheets/${ws.id}/diff?from=A&to=B`));
    expectShape(revisionDiffSchema, diff);
    const { inputs, results } = revisionDiffSchema.parse(diff);
    expect(inputs).toEqual([
      {
        path: 'elements.r2.value',
        change: 'changed',
        before: 1000,
        after: 660,
        delta: -340,
        relative: -0.34,
      },
    ]);
    const moved = (path: string) => results.find((e) => e.path === path);
    expectMoved(moved('results.nodes.out'), 2.5, vout(660));
    expectMoved(moved('results.elements.r2.current'), 5 / 2000, 5 / 1660);
    expectMoved(moved('results.sources.v1'), -5 / 2000, -5 / 1660);
    expectMoved(moved('results.supplyPower'), 25 / 2000, 25 / 1660);
    expectMoved(moved('results.gain.vv'), 0.5, 660 / 1660);
    expectMoved(moved('results.zin.ohm'), 2000, 1660);
    expect(moved('results.nodes.in')).toBeUndefined();
    const bc = revisionDiffSchema.parse(await ok(kim.get(`/worksheets/${ws.id}/diff?from=B&to=C`)));
    expect(bc.inputs).toEqual([
      {
        path: 'elements.r2.value',
        change: 'changed',
        before: 660,
        after: 680,
        delta: 20,
        relative: 20 / 660,
      },
    ]);
    expectMoved(
      bc.results.find((e) => e.path === 'results.nodes.out'),
      vout(660),
      vout(680),
    );

    // Every e-mail of the path, to the right person with the worksheet's link, delivered once.
    const who = (name: string) => team.people[name]!.email;
    const rows = await outboxOf(t, team.org.id, ws.id);
    expect(rows.map((r) => `${r.kind} → ${r.to_address}`).sort()).toEqual(
      [
        ['worksheet.submitted', 'kim'],
        ['finding.raised', 'ann'],
        ['finding.raised', 'ann'],
        ['finding.raised', 'ann'],
        ['finding.replied', 'ann'], // the checker's reply
        ['finding.replied', 'kim'], // the author's reply
        ['finding.replied', 'ann'], // the approver's reply, to both parties
        ['finding.replied', 'kim'],
        ['worksheet.returned', 'ann'],
        ['finding.answered', 'kim'],
        ['worksheet.submitted', 'kim'],
        ['worksheet.accepted', 'abe'],
        ['worksheet.signed', 'ann'],
        ['worksheet.signed', 'kim'],
        ['worksheet.submitted', 'kim'],
        ['worksheet.accepted', 'abe'],
        ['worksheet.signed', 'ann'],
        ['worksheet.signed', 'kim'],
      ]
        .map(([kind, name]) => `${kind} → ${who(name!)}`)
        .sort(),
    );
    const link = `http://biasproof.test.example/o/${team.org.slug}/worksheets/${ws.id}`;
    expect(rows.every((r) => r.link === link)).toBe(true);
    const raised = rows.find(
      (r) => r.kind === 'finding.raised' && r.text_body.includes('nodes.out'),
    );
    expect(raised?.subject).toBe('Finding (major) on "Bias divider" revision A: nodes.out');
    expect(raised?.text_body).toContain('The output should sit near 2.0 V.');
    expect(rows.find((r) => r.kind === 'finding.answered')?.text_body).toContain(
      'R2 is now 660 Ω.',
    );
    await drainOutbox(t, team.org.id);
    await expectDelivered(rows, link);
  });

  const id = (name: string) => team.people[name]!.id;
});

function valueOf(detail: Record<string, unknown>, element: string): unknown {
  const circuit = detail.circuit as { elements: { name: string; value?: number }[] };
  return circuit.elements.find((e) => e.name === element)?.value;
}

/** A result entry that moved from `before` to `after`, with delta and relative change to match. */
function expectMoved(entry: DiffEntry | undefined, before: number, after: number): void {
  expect(entry?.change).toBe('changed');
  expect(entry?.before).toBeCloseTo(before, 12);
  expect(entry?.after).toBeCloseTo(after, 12);
  expect(entry?.delta).toBeCloseTo(after - before, 12);
  expect(entry?.relative).toBeCloseTo((after - before) / Math.abs(before), 12);
}
