import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes, type Sequelize } from 'sequelize';
import { createSequelize } from '../../db/connection.ts';
import { createMigrator } from '../../db/migrator.ts';
import { testEnv } from '../../test-support/test-env.ts';

// Migration 20261202-01 on a database that already holds worksheets: the backfill of each
// revision's state and submission time, the state following the worksheet, and the way back.
const before = '20261201-08-mail-outbox';
const mine = '20261202-01-review-history';
const hash = 'a'.repeat(64);

describe('migration 20261202-01: revision states', () => {
  const name = `biasproof_history_${Date.now().toString(36)}_${process.pid}`;
  const admin = createSequelize(testEnv.databaseUrl);
  let db: Sequelize;
  beforeAll(async () => {
    await admin.query(`CREATE DATABASE "${name}"`);
    db = createSequelize(testEnv.databaseUrl.replace(/\/[^/?]+(\?.*)?$/, `/${name}$1`));
    await createMigrator(db).up({ to: before });
  });
  afterAll(async () => {
    await db.close();
    await admin.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
    await admin.close();
  });

  /** Statements in the system scope, as an operator runs them. */
  const system = <T extends object>(sql: string, bind: unknown[] = []) =>
    db.transaction(async (transaction) => {
      await db.query("SELECT set_config('biasproof.org_id', '*', true)", { transaction });
      return db.query<T>(sql, { bind, transaction, type: QueryTypes.SELECT });
    });

  it('when it runs over existing worksheets, then each revision gets its state and submission time, the current one follows its worksheet, and down() restores the old schema', async () => {
    const [ids] = await system<Record<'org' | 'user' | 'project' | 'w1' | 'w2' | 'w3', string>>(
      `WITH o AS (INSERT INTO organizations (slug, name) VALUES ('mig-history', 'Migration') RETURNING id),
            u AS (INSERT INTO users (email, name, password_hash) VALUES ('ann@mig.example', 'Ann', 'x') RETURNING id),
            p AS (INSERT INTO projects (org_id, name, code, created_by_user_id)
                  SELECT o.id, 'P', 'P1', u.id FROM o, u RETURNING id, org_id),
            w AS (INSERT INTO worksheets (org_id, project_id, title, author_user_id, state, current_revision)
                  SELECT p.org_id, p.id, x.title, u.id, x.state, x.cur
                    FROM p, u, (VALUES ('W1', 'in_check', 'B'), ('W2', 'signed_off', 'A'), ('W3', 'draft', 'A'))
                         AS x (title, state, cur)
                  RETURNING id, title)
       SELECT (SELECT id FROM o) AS org, (SELECT id FROM u) AS "user", (SELECT id FROM p) AS project,
              (SELECT id FROM w WHERE title = 'W1') AS w1, (SELECT id FROM w WHERE title = 'W2') AS w2,
              (SELECT id FROM w WHERE title = 'W3') AS w3`,
    );
    const { org, user, w1, w2, w3 } = ids!;
    await system(
      `INSERT INTO revisions (org_id, worksheet_id, letter, circuit, settings, results, result_status,
                              engine_version, content_hash, frozen, created_by_user_id, updated_at)
       VALUES ($1, $2, 'A', '{}', '{}', '{}', 'empty', 'e', $5, true, $6, '2026-11-01T09:00:00Z'),
              ($1, $2, 'B', '{}', '{}', '{}', 'empty', 'e', $5, true, $6, '2026-11-03T09:00:00Z'),
              ($1, $3, 'A', '{}', '{}', '{}', 'empty', 'e', $5, true, $6, '2026-11-04T09:00:00Z'),
              ($1, $4, 'A', '{}', '{}', '{}', 'empty', 'e', $5, false, $6, '2026-11-05T09:00:00Z')
       RETURNING id`,
      [org, w1, w2, w3, hash, user],
    );
    await system(
      `INSERT INTO audit_events (id, org_id, seq, at, actor_user_id, action, target_type, target_id, details, prev_hash, hash)
       VALUES (gen_random_uuid(), $1, 1, '2026-11-01T10:00:00Z', $3, 'worksheet.submitted', 'worksheet', $2, '{"revision":"A"}', '', 'h1'),
              (gen_random_uuid(), $1, 2, '2026-11-02T10:00:00Z', $3, 'worksheet.submitted', 'worksheet', $2, '{"revision":"A"}', 'h1', 'h2'),
              (gen_random_uuid(), $1, 3, '2026-11-03T10:00:00Z', $3, 'worksheet.submitted', 'worksheet', $2, '{"revision":"B"}', 'h2', 'h3')
       RETURNING id`,
      [org, w1, user],
    );

    await createMigrator(db).up({ to: mine });

    const revisions = () =>
      system<{ worksheet_id: string; letter: string; state: string; submitted_at: Date | null }>(
        `SELECT worksheet_id, letter, state, submitted_at FROM revisions ORDER BY updated_at`,
      );
    expect(
      (await revisions()).map((r) => [
        r.worksheet_id,
        r.letter,
        r.state,
        r.submitted_at?.toISOString() ?? null,
      ]),
    ).toEqual([
      // A was submitted twice (returned in between): the first submission froze it.
      [w1, 'A', 'returned', '2026-11-01T10:00:00.000Z'],
      [w1, 'B', 'in_check', '2026-11-03T10:00:00.000Z'],
      // Frozen without a submission event (e.g. loaded data): its last change stands in.
      [w2, 'A', 'signed_off', '2026-11-04T09:00:00.000Z'],
      [w3, 'A', 'draft', null],
    ]);
    await system(`UPDATE worksheets SET state = 'checked' WHERE id = $1 RETURNING id`, [w1]);
    expect((await revisions()).slice(0, 2).map((r) => r.state)).toEqual(['returned', 'checked']);
    await expect(
      system(`UPDATE revisions SET results = '{"x":1}' WHERE worksheet_id = $1 RETURNING id`, [w1]),
    ).rejects.toThrow(/is frozen/);

    await createMigrator(db).down();
    const columns = await system<{ column_name: string }>(
      `SELECT column_name FROM information_schema.columns
        WHERE table_name = 'revisions' AND column_name IN ('state', 'submitted_at')`,
    );
    expect(columns).toEqual([]);
    await expect(
      system(`UPDATE revisions SET content_hash = $2 WHERE worksheet_id = $1 RETURNING id`, [
        w1,
        hash,
      ]),
    ).rejects.toThrow(/is frozen/);
  });
});
