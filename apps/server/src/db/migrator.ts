import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { Umzug, SequelizeStorage } from 'umzug';
import type { QueryInterface, Sequelize } from 'sequelize';

export interface MigrationContext {
  queryInterface: QueryInterface;
  sequelize: Sequelize;
}

interface MigrationModule {
  up: (ctx: MigrationContext) => Promise<void>;
  down?: (ctx: MigrationContext) => Promise<void>;
}

const migrationsDir = join(import.meta.dirname, 'migrations');

/**
 * Migrations are TypeScript modules in db/migrations, applied in file-name order and recorded
 * in the `schema_migrations` table. Each exports `up` (and `down` where it can be undone).
 */
export function createMigrator(sequelize: Sequelize): Umzug<MigrationContext> {
  const files = readdirSync(migrationsDir)
    .filter((f) => /^\d{8}-\d{2}-[a-z0-9-]+\.ts$/.test(f))
    .sort();
  return new Umzug<MigrationContext>({
    migrations: files.map((file) => {
      const load = async () =>
        (await import(pathToFileURL(join(migrationsDir, file)).href)) as MigrationModule;
      return {
        name: file.replace(/\.ts$/, ''),
        up: async ({ context }) => (await load()).up(context),
        down: async ({ context }) => {
          const m = await load();
          if (!m.down) throw new Error(`migration ${file} cannot be undone`);
          await m.down(context);
        },
      };
    }),
    context: { queryInterface: sequelize.getQueryInterface(), sequelize },
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}

/** Applies every pending migration; returns the names applied. */
export async function migrateToLatest(sequelize: Sequelize): Promise<string[]> {
  const applied = await createMigrator(sequelize).up();
  return applied.map((m) => m.name);
}
