import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createLogger } from '../../logger.ts';
import { createMailTransport } from '../../mail/mail-transport.ts';
import { createMailer, messageIdFor } from '../../mail/send-mail.ts';
import { createTeam, newProject, type Team } from '../../test-support/team.ts';
import type { CapturedEmail } from '../../test-support/maildev.ts';
import {
  claimNextMessage,
  CLAIM_LEASE_SECONDS,
  dispatchOutbox,
  outgoingOf,
  startOutboxDispatcher,
} from '../dispatcher.ts';
import {
  createOutboxWorld,
  outboxRows,
  signedWorksheet,
  submittedWorksheet,
  type OutboxWorld,
} from './outbox-world.ts';

type WithHeaders = CapturedEmail & { headers: Record<string, string | string[]> };
const messageIdOf = (m: CapturedEmail) => (m as WithHeaders).headers['message-id'];

async function until(what: string, check: () => Promise<boolean>, timeoutMs = 15_000) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (await check()) return;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`timed out waiting until ${what}`);
}

describe('outbox delivery across a mail server outage, a restart and a crash', () => {
  let w: OutboxWorld;
  let team: Team;
  let projectId: string;
  const from = 'Biasproof <no-reply@biasproof.example>';
  beforeAll(async () => {
    w = await createOutboxWorld();
    team = await createTeam(w.t);
    projectId = (await newProject(team.as.ann)).id;
  });
  afterAll(() => w.close());

  it('when maildev is stopped while three transitions run and the dispatcher restarts, then once maildev is back every message is delivered exactly once', async () => {
    await dispatchOutbox(w.t.sequelize, w.t.mailer);
    await w.maildev.stop();
    const ws = await signedWorksheet(team, projectId, `Outage ${Date.now()}`);
    const rows = (await outboxRows(w.t)).filter((r) => r.sent_at === null);
    // The two messages of one step share created_at (the transaction's time): compare sorted.
    expect(rows.map((r) => `${r.kind} ${r.to_address}`).sort()).toEqual(
      [
        `worksheet.submitted ${team.people.kim!.email}`,
        `worksheet.accepted ${team.people.abe!.email}`,
        `worksheet.signed ${team.people.ann!.email}`,
        `worksheet.signed ${team.people.kim!.email}`,
      ].sort(),
    );
    const ids = rows.map((r) => r.id);
    const logger = createLogger('silent');

    // The server's dispatcher runs while SMTP refuses connections, then the process stops.
    const first = startOutboxDispatcher(w.t.sequelize, w.t.mailer, logger, 50);
    await until('every message has failed once', async () =>
      (await outboxRows(w.t, 'id = ANY($1::uuid[])', [ids])).every(
        (r) => r.attempts >= 1 && r.last_error !== null,
      ),
    );
    await first.stop();
    expect(await w.maildev.list().catch(() => 'down')).toBe('down');

    // Mail is back; a new dispatcher (a restarted server) takes over. Its clock runs an hour
    // ahead so the backoff does not make the test wait.
    await w.maildev.start();
    const hourAhead = () => new Date(Date.now() + 3600_000);
    const second = startOutboxDispatcher(w.t.sequelize, w.t.mailer, logger, 50, {
      now: hourAhead,
    });
    await until('every message is marked sent', async () =>
      (await outboxRows(w.t, 'id = ANY($1::uuid[])', [ids])).every((r) => r.sent_at !== null),
    );
    await second.stop();
    expect(await dispatchOutbox(w.t.sequelize, w.t.mailer, { now: hourAhead })).toEqual({
      sent: 0,
      failed: 0,
    });

    const delivered = (await w.maildev.list()).filter((m) => (m.text ?? '').includes(ws.id));
    expect(delivered.map((m) => messageIdOf(m)).sort()).toEqual(
      ids.map((id) => messageIdFor(`outbox.${id}`, from)).sort(),
    );
    expect(delivered.map((m) => [m.to[0]?.address, m.subject]).sort()).toEqual(
      rows.map((r) => [r.to_address, r.subject]).sort(),
    );
  });

  it('when the dispatcher dies after SMTP accepted a message but before marking it sent, then after its claim runs out the message is sent again with the same Message-ID and marked sent once', async () => {
    await dispatchOutbox(w.t.sequelize, w.t.mailer);
    const ws = await submittedWorksheet(team, projectId, `Crash ${Date.now()}`);
    const mailer = createMailer(
      createMailTransport({ host: '127.0.0.1', port: w.maildev.smtpPort, from }),
      from,
    );

    // A dispatcher claims the message and hands it to SMTP, then its process dies.
    const claimed = await claimNextMessage(w.t.sequelize, new Date());
    expect(claimed).not.toBeNull();
    await mailer.send(outgoingOf(claimed!));

    // While the dead dispatcher's claim lasts, nobody sends the message again.
    expect(await dispatchOutbox(w.t.sequelize, w.t.mailer)).toEqual({ sent: 0, failed: 0 });
    const afterLease = () => new Date(Date.now() + (CLAIM_LEASE_SECONDS + 1) * 1000);
    expect(await dispatchOutbox(w.t.sequelize, w.t.mailer, { now: afterLease })).toEqual({
      sent: 1,
      failed: 0,
    });
    expect(await dispatchOutbox(w.t.sequelize, w.t.mailer, { now: afterLease })).toEqual({
      sent: 0,
      failed: 0,
    });

    const copies = (await w.maildev.list()).filter((m) => (m.text ?? '').includes(ws.id));
    expect(copies).toHaveLength(2);
    expect(new Set(copies.map(messageIdOf))).toEqual(
      new Set([messageIdFor(`outbox.${claimed!.id}`, from)]),
    );
    const [row] = await outboxRows(w.t, 'id = $1', [claimed!.id]);
    expect(row).toMatchObject({ attempts: 2, last_error: null, claimed_until: null });
    expect(row!.sent_at).not.toBeNull();
  });
});
