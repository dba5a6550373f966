import type { MigrationContext } from '../migrator.ts';

// Failed sign-in counters, one row per key (`account:<e-mail>` or `ip:<address>`), counted in
// a fixed window; `locked_until` is set when a key reaches its limit.
export async function up({ sequelize }: MigrationContext): Promise<void> {
  await sequelize.query(`
    CREATE TABLE sign_in_throttles (
      key text PRIMARY KEY,
      failures integer NOT NULL DEFAULT 0,
      window_started_at timestamptz NOT NULL DEFAULT now(),
      locked_until timestamptz
    );
  `);
}

export async function down({ sequelize }: MigrationContext): Promise<void> {
  await sequelize.query('DROP TABLE IF EXISTS sign_in_throttles');
}
