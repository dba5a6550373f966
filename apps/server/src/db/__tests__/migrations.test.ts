import { afterAll, describe, expect, it } from 'vitest';
import { createTestApp } from '../../test-support/test-app.ts';
import { migrateToLatest } from '../migrator.ts';

describe('migrations', () => {
  const t = createTestApp();
  afterAll(() => t.close());

  it('when the run database was migrated, then migrating again applies nothing', async () => {
    expect(await migrateToLatest(t.sequelize)).toEqual([]);
  });

  it('when migrated, then the session table exists with its expiry index and its per-user index', async () => {
    const [rows] = await t.sequelize.query(
      "SELECT indexname FROM pg_indexes WHERE tablename = 'session' ORDER BY indexname",
    );
    expect((rows as { indexname: string }[]).map((r) => r.indexname)).toEqual([
      'session_expire_idx',
      'session_pkey',
      'session_user_id_idx',
    ]);
  });

  it('when migrated, then every organization-owned table enforces row-level security, even for its owner', async () => {
    const [rows] = await t.sequelize.query(
      `SELECT relname, relrowsecurity, relforcerowsecurity FROM pg_class
        WHERE relname IN ('organizations', 'memberships', 'invitations', 'audit_events', 'audit_chain_heads')
        ORDER BY relname`,
    );
    expect(rows).toEqual(
      ['audit_chain_heads', 'audit_events', 'invitations', 'memberships', 'organizations'].map(
        (relname) => ({
          relname,
          relrowsecurity: true,
          relforcerowsecurity: true,
        }),
      ),
    );
  });

  it('when an e-mail is stored twice or in capitals, then the users table refuses it', async () => {
    const email = `case.twin.${Date.now()}@fixture.example`;
    await t.sequelize.query(
      `INSERT INTO users (email, name, password_hash) VALUES ($1, 'A', 'x')`,
      { bind: [email] },
    );
    await expect(
      t.sequelize.query(`INSERT INTO users (email, name, password_hash) VALUES ($1, 'B', 'x')`, {
        bind: [email],
      }),
    ).rejects.toMatchObject({ parent: { constraint: 'users_email_lower_key' } });
    await expect(
      t.sequelize.query(`INSERT INTO users (email, name, password_hash) VALUES ($1, 'C', 'x')`, {
        bind: [email.toUpperCase()],
      }),
    ).rejects.toMatchObject({ parent: { constraint: 'users_email_check' } });
  });
});
