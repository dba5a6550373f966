import { expect } from 'vitest';
import { createTestApp, type TestApp } from '../../test-support/test-app.ts';
import { systemRows, TEST_PASSWORD } from '../../test-support/fixtures.ts';
import { newWorksheet, type OrgApi, type Team } from '../../test-support/team.ts';
import { dividerDraft } from '../../worksheets/__tests__/worksheet-drafts.ts';
import { createPrivateDatabase, OwnMaildev } from './private-services.ts';

/** The app over a database and a maildev of its own (private-services.ts explains why). */
export interface OutboxWorld {
  t: TestApp;
  maildev: OwnMaildev;
  close(): Promise<void>;
}

export async function createOutboxWorld(): Promise<OutboxWorld> {
  const db = await createPrivateDatabase();
  const maildev = await OwnMaildev.create();
  await maildev.start();
  const t = createTestApp({ databaseUrl: db.url, env: { SMTP_PORT: String(maildev.smtpPort) } });
  return {
    t,
    maildev,
    async close() {
      await t.close();
      await maildev.stop();
      await db.drop();
    },
  };
}

export interface OutboxRow {
  id: string;
  org_id: string | null;
  kind: string;
  to_address: string;
  subject: string;
  text_body: string;
  html_body: string | null;
  link: string | null;
  attempts: number;
  sent_at: Date | null;
  next_attempt_at: Date;
  last_error: string | null;
  claimed_until: Date | null;
  digest_id: string | null;
  digest_day: string | null;
}

export const outboxRows = (t: TestApp, where = 'true', bind: unknown[] = []) =>
  systemRows<OutboxRow>(
    t,
    `SELECT * FROM outbox_messages WHERE ${where} ORDER BY created_at, id`,
    bind,
  );

/** One workflow step that must succeed. */
export async function step(api: OrgApi, worksheetId: string, body: object): Promise<void> {
  const res = await api.post(`/worksheets/${worksheetId}/transitions`, body);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
}

/** A worksheet by ann with kim checking and abe approving, submitted (version 3 after). */
export async function submittedWorksheet(team: Team, projectId: string, title: string) {
  const ws = await newWorksheet(team.as.ann, projectId, { ...dividerDraft(), title });
  const assigned = await team.as.ann.patch(`/worksheets/${ws.id}`, {
    version: 1,
    checkerId: team.people.kim!.id,
    approverId: team.people.abe!.id,
  });
  expect(assigned.status, JSON.stringify(assigned.body)).toBe(200);
  await step(team.as.ann, ws.id, { action: 'submit', version: 2 });
  return ws;
}

/** Submit, accept and sign: four messages (checker, approver, then author and checker). */
export async function signedWorksheet(team: Team, projectId: string, title: string) {
  const ws = await submittedWorksheet(team, projectId, title);
  await step(team.as.kim, ws.id, { action: 'accept', version: 3 });
  await step(team.as.abe, ws.id, {
    action: 'sign',
    version: 4,
    meaning: 'Reviewed',
    password: TEST_PASSWORD,
  });
  return ws;
}
