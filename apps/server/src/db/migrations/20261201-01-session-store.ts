import type { MigrationContext } from '../migrator.ts';

// The table connect-pg-simple expects for express-session (its documented schema), so that
// sessions live in PostgreSQL and survive a server restart.
export async function up({ sequelize }: MigrationContext): Promise<void> {
  await sequelize.query(`
    CREATE TABLE IF NOT EXISTS "session" (
      "sid" varchar NOT NULL COLLATE "default" PRIMARY KEY,
      "sess" json NOT NULL,
      "expire" timestamp(6) NOT NULL
    );
    CREATE INDEX IF NOT EXISTS "session_expire_idx" ON "session" ("expire");
  `);
}

export async function down({ sequelize }: MigrationContext): Promise<void> {
  await sequelize.query('DROP TABLE IF EXISTS "session"');
}
