import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { anonymousAgent } from '../../test-support/fixtures.ts';
import { createTeam, newProject, type Team } from '../../test-support/team.ts';
import { dispatchOutbox } from '../dispatcher.ts';
import { lastDigestSlot } from '../digest.ts';
import {
  createOutboxWorld,
  outboxRows,
  signedWorksheet,
  type OutboxWorld,
} from './outbox-world.ts';

const DAY_MS = 24 * 60 * 60 * 1000;

describe('daily digest of workflow e-mail', () => {
  let w: OutboxWorld;
  let team: Team;
  let projectId: string;
  beforeAll(async () => {
    w = await createOutboxWorld();
    team = await createTeam(w.t);
    projectId = (await newProject(team.as.ann)).id;
  });
  afterAll(() => w.close());

  const setDelivery = (delivery: string, digestHourUtc = 7) =>
    team.as.ann.agent
      .put('/api/account/notifications')
      .set('x-csrf-token', team.as.ann.csrf)
      .send({ delivery, digestHourUtc });
  const mailsTo = async (address: string) =>
    (await w.maildev.list()).filter((m) => m.to[0]?.address === address);
  const annHeld = () =>
    outboxRows(w.t, "to_address = $1 AND kind LIKE 'worksheet.%' AND sent_at IS NULL", [
      team.people.ann!.email,
    ]);

  it('when the author chose a digest, then her workflow messages wait for her digest hour and go out as one message listing each, each marked sent once, one digest a day', async () => {
    expect((await setDelivery('daily-digest', 7)).status).toBe(200);
    const one = await signedWorksheet(team, projectId, `Preamp ${Date.now()}`);
    const two = await signedWorksheet(team, projectId, `Supply ${Date.now()}`);

    await dispatchOutbox(w.t.sequelize, w.t.mailer);

    // The others got theirs at once; the author's are held.
    expect((await mailsTo(team.people.kim!.email)).length).toBeGreaterThanOrEqual(4);
    expect(await mailsTo(team.people.ann!.email)).toEqual([]);
    const held = await annHeld();
    expect(held.map((r) => r.subject).sort()).toEqual(
      [`Signed off: "${one.title}" revision A`, `Signed off: "${two.title}" revision A`].sort(),
    );

    const slot = lastDigestSlot(new Date(Date.now() + DAY_MS), 7);
    const atDigestHour = () => new Date(slot.getTime() + 5 * 60_000);
    await dispatchOutbox(w.t.sequelize, w.t.mailer, { now: atDigestHour });

    const [digest] = await outboxRows(w.t, "kind = 'digest.daily'");
    expect(digest).toMatchObject({
      org_id: null,
      to_address: team.people.ann!.email,
      subject: `Biasproof digest for ${slot.toISOString().slice(0, 10)}: 2 updates`,
      attempts: 1,
    });
    expect(digest!.sent_at).not.toBeNull();
    const marked = await outboxRows(w.t, 'id = ANY($1::uuid[])', [held.map((r) => r.id)]);
    expect(marked.every((r) => r.digest_id === digest!.id && r.sent_at !== null)).toBe(true);
    expect(marked.every((r) => r.attempts === 0)).toBe(true);

    const received = await mailsTo(team.people.ann!.email);
    expect(received).toHaveLength(1);
    for (const r of held) {
      expect(received[0]!.text).toContain(`- ${r.subject}: ${r.link}`);
      expect(received[0]!.html).toContain(`href="${r.link}"`);
    }

    // The same day again: no second digest; a message written now waits for the next day.
    const three = await signedWorksheet(team, projectId, `Mixer ${Date.now()}`);
    await dispatchOutbox(w.t.sequelize, w.t.mailer, { now: atDigestHour });
    expect(await outboxRows(w.t, "kind = 'digest.daily'")).toHaveLength(1);
    expect((await annHeld()).map((r) => r.subject)).toEqual([
      `Signed off: "${three.title}" revision A`,
    ]);
    const nextDay = () => new Date(atDigestHour().getTime() + DAY_MS);
    await dispatchOutbox(w.t.sequelize, w.t.mailer, { now: nextDay });
    const digests = await outboxRows(w.t, "kind = 'digest.daily'");
    expect(digests).toHaveLength(2);
    expect(digests[1]!.subject).toMatch(/: 1 update$/);
    expect(await annHeld()).toEqual([]);
    expect(await mailsTo(team.people.ann!.email)).toHaveLength(2);
  });

  it('when a person on the digest asks for a password reset, then that e-mail is not held', async () => {
    expect((await setDelivery('daily-digest', 7)).status).toBe(200);
    const { agent, csrf } = await anonymousAgent(w.t);

    await agent
      .post('/api/auth/password-reset')
      .set('x-csrf-token', csrf)
      .send({ email: team.people.ann!.email })
      .expect(202);

    const deadline = Date.now() + 10_000;
    while (!(await mailsTo(team.people.ann!.email)).some((m) => /Reset/.test(m.subject))) {
      if (Date.now() > deadline) throw new Error('the reset e-mail was held');
      await new Promise((r) => setTimeout(r, 100));
    }
  });

  it('when the author switches back to immediate, then messages held for her go out at the next pass', async () => {
    expect((await setDelivery('daily-digest', 7)).status).toBe(200);
    await signedWorksheet(team, projectId, `Filter ${Date.now()}`);
    await dispatchOutbox(w.t.sequelize, w.t.mailer);
    expect(await annHeld()).toHaveLength(1);

    expect((await setDelivery('immediate')).status).toBe(200);
    await dispatchOutbox(w.t.sequelize, w.t.mailer);

    expect(await annHeld()).toEqual([]);
  });
});
