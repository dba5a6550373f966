import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { watchersResponseSchema } from '@biasproof/shared';
import { createTestApp } from '../../test-support/test-app.ts';
import { TEST_PASSWORD } from '../../test-support/fixtures.ts';
import {
  auditEvents,
  createTeam,
  expectShape,
  newProject,
  newWorksheet,
  type Team,
} from '../../test-support/team.ts';
import { dividerDraft } from '../../worksheets/__tests__/worksheet-drafts.ts';
import { drainOutbox, outboxOf } from './review-mail.ts';

describe('review: watchers and the signed e-mail', () => {
  const t = createTestApp();
  let team: Team;
  beforeAll(async () => {
    team = await createTeam(t);
  });
  afterAll(() => t.close());

  it('when a member watches a worksheet that is then signed, then the signed e-mail reaches author, checker and watcher once each, with the report link', async () => {
    const { ann, kim, abe, max, bob } = team.as;
    const projectId = (await newProject(ann)).id;
    const ws = await newWorksheet(ann, projectId, dividerDraft());
    await ann.patch(`/worksheets/${ws.id}`, {
      version: 1,
      checkerId: team.people.kim!.id,
      approverId: team.people.abe!.id,
    });

    const watched = await max.put(`/worksheets/${ws.id}/watchers/me`);
    await max.put(`/worksheets/${ws.id}/watchers/me`); // twice: still one watcher, one event
    await bob.put(`/worksheets/${ws.id}/watchers/me`);
    const unwatched = await bob.delete(`/worksheets/${ws.id}/watchers/me`);
    await ann.put(`/worksheets/${ws.id}/watchers/me`); // the author watching gets one mail, not two

    expect(watched.status).toBe(200);
    expectShape(watchersResponseSchema, watched.body);
    expect(watched.body).toEqual({
      watching: true,
      watchers: [{ id: team.people.max!.id, name: team.people.max!.name }],
    });
    expect(unwatched.body.watching).toBe(false);
    expect(await auditEvents(t, team.org.id, 'worksheet.watch-started')).toHaveLength(3);
    expect(await auditEvents(t, team.org.id, 'worksheet.watch-stopped')).toHaveLength(1);
    expect((await kim.get(`/worksheets/${ws.id}/watchers`)).body.watchers).toHaveLength(2);

    const step = (api: typeof ann, body: object) =>
      api.post(`/worksheets/${ws.id}/transitions`, body);
    expect((await step(ann, { action: 'submit', version: 2 })).status).toBe(200);
    expect((await step(kim, { action: 'accept', version: 3 })).status).toBe(200);
    const signed = await step(abe, {
      action: 'sign',
      version: 4,
      meaning: 'Reviewed',
      password: TEST_PASSWORD,
    });
    expect(signed.status).toBe(200);

    await drainOutbox(t, team.org.id);
    const mails = (await outboxOf(t, team.org.id, ws.id)).filter(
      (m) => m.kind === 'worksheet.signed',
    );
    expect(mails.map((m) => m.to_address).sort()).toEqual(
      [team.people.ann!.email, team.people.kim!.email, team.people.max!.email].sort(),
    );
    const report = `/api/orgs/${team.org.id}/worksheets/${ws.id}/revisions/A/report.pdf`;
    for (const m of mails) {
      expect(m.text_body).toContain(report);
      expect(m.html_body).toContain(`${report}"`);
      expect(m.sent_at).not.toBeNull();
    }
  });

  it('when someone watches a worksheet that does not exist, then 404 and nothing is stored', async () => {
    const res = await team.as.max.put(
      '/worksheets/00000000-0000-4000-8000-000000000000/watchers/me',
    );
    expect(res.status).toBe(404);
  });
});
