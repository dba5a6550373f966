// `npm run migrate`: applies pending migrations to DATABASE_URL and exits.
import { loadConfig } from '../config.ts';
import { createSequelize } from './connection.ts';
import { migrateToLatest } from './migrator.ts';

const config = loadConfig();
const sequelize = createSequelize(config.databaseUrl);
try {
  const applied = await migrateToLatest(sequelize);
  console.log(applied.length ? `applied: ${applied.join(', ')}` : 'database is up to date');
} finally {
  await sequelize.close();
}
