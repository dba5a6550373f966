// Loads the demo scenario into an empty database (run by `npm start` and `npm run dev` after
// migrations). Each step checks whether its data is already there, so running it again on a
// loaded database changes nothing. On stdout it prints the demo sign-ins, one per line, for
// the start script to show; everything else goes to stderr.
import { loadConfig } from '../../apps/server/src/config.ts';
import { createSequelize } from '../../apps/server/src/db/connection.ts';
import { migrateToLatest } from '../../apps/server/src/db/migrator.ts';
import { demoSteps } from './demo-steps.ts';

const config = loadConfig();
const sequelize = createSequelize(config.databaseUrl);
try {
  await migrateToLatest(sequelize);
  const signIns: string[] = [];
  for (const step of demoSteps) {
    const result = await step.load(sequelize, config);
    if (result.loaded) console.error(`[seed] ${step.name}: loaded`);
    signIns.push(...result.signIns);
  }
  if (signIns.length) console.log(signIns.join('\n'));
} finally {
  await sequelize.close();
}
