// `npm start`: PostgreSQL (installed when missing), migrations, the demo data when the
// database is empty, maildev, a fresh web build when needed, and the server on
// http://localhost:3000. Ctrl-C stops everything this command started.
import { join } from 'node:path';
import { run, stopAllChildren } from './lib/processes.mjs';
import {
  log,
  rootDir,
  startMaildev,
  startPostgres,
  stopPostgres,
  portIsFree,
} from './lib/services.mjs';
import { buildWebIfStale, webDist } from './lib/web-build.mjs';
import { startServer } from './lib/server.mjs';

const port = Number(process.env.PORT ?? 3000);
const smtpPort = Number(process.env.SMTP_PORT ?? 1025);
const mailWebPort = Number(process.env.MAILDEV_WEB_PORT ?? 1080);
const tsx = join(rootDir, 'node_modules', 'tsx', 'dist', 'cli.mjs');
let startedPostgres = false;

async function stopEverything(code) {
  log('stopping');
  await stopAllChildren();
  if (startedPostgres) await stopPostgres();
  process.exit(code);
}

async function main() {
  if (!(await portIsFree(port)))
    throw new Error(
      `port ${port} is taken; is Biasproof already running? (set PORT to use another)`,
    );
  startedPostgres = await startPostgres();

  const env = {
    SMTP_PORT: String(smtpPort),
    PORT: String(port),
    WEB_DIST: webDist,
    APP_URL: `http://localhost:${port}`,
  };
  const migrated = await run(
    process.execPath,
    [tsx, join(rootDir, 'apps', 'server', 'src', 'db', 'migrate-cli.ts')],
    {
      env: { ...process.env, ...env },
      echo: true,
    },
  );
  if (migrated.code !== 0) throw new Error('migrations failed');
  const seeded = await run(process.execPath, [tsx, join(rootDir, 'seed', 'src', 'load-demo.ts')], {
    env: { ...process.env, ...env },
  });
  if (seeded.code !== 0) throw new Error('loading the demo data failed');
  const demoSignIns = seeded.stdout.trim();

  await startMaildev({ smtpPort, webPort: mailWebPort });
  await buildWebIfStale();
  await startServer(env);

  log('');
  log(`Biasproof       http://localhost:${port}`);
  log(
    `Mail inbox      http://localhost:${mailWebPort}   (maildev: every e-mail the app sends lands here)`,
  );
  log(
    `Database        postgres://127.0.0.1:${process.env.PGPORT ?? 54329} (project-local, data in .data/pg)`,
  );
  if (demoSignIns) for (const line of demoSignIns.split('\n')) log(line);
  log('Press Ctrl-C to stop.');
}

process.on('SIGINT', () => void stopEverything(0));
process.on('SIGTERM', () => void stopEverything(0));
try {
  await main();
} catch (e) {
  log(`could not start: ${e instanceof Error ? e.message : String(e)}`);
  await stopEverything(1);
}
