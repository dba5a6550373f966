// `npm test`: starts what the tests need (PostgreSQL, maildev, the server for browser tests),
// runs every workspace's vitest project in one vitest run, stops what it started and prints
// one closing line: `N passed, N failed[, N skipped]`. Extra arguments go to vitest, e.g.
// `npm test -- --project calc` or `npm test -- apps/server/src/health`.
import { mkdirSync, readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { run, stopAllChildren } from './lib/processes.mjs';
import {
  ensureDebianPackage,
  log,
  rootDir,
  startMaildev,
  startPostgres,
  stopPostgres,
} from './lib/services.mjs';
import { createTestDatabase, dropTestDatabase } from './lib/test-database.mjs';
import { freePort } from './lib/free-port.mjs';
import { buildWebIfStale, webDist } from './lib/web-build.mjs';
import { startServer } from './lib/server.mjs';

const vitestArgs = process.argv.slice(2);
const resultsFile = join(rootDir, '.data', 'test-results.json');
let startedPostgres = false;
let database;

async function cleanUp() {
  await stopAllChildren();
  if (database)
    await dropTestDatabase(database.name).catch((e) =>
      log(`could not drop ${database.name}: ${e.message}`),
    );
  if (startedPostgres) await stopPostgres();
}

function summarize() {
  try {
    const r = JSON.parse(readFileSync(resultsFile, 'utf8'));
    const skipped = (r.numPendingTests ?? 0) + (r.numTodoTests ?? 0);
    // A test file that fails to load has no failed test of its own; count it so it shows.
    const brokenFiles = (r.testResults ?? []).filter(
      (f) => f.status === 'failed' && f.assertionResults.length === 0,
    ).length;
    return { passed: r.numPassedTests, failed: r.numFailedTests + brokenFiles, skipped };
  } catch {
    return { passed: 0, failed: 1, skipped: 0 };
  }
}

async function main() {
  await ensureDebianPackage('/usr/bin/chromium', 'chromium');
  await ensureDebianPackage('/usr/bin/ngspice', 'ngspice');
  await ensureDebianPackage('/usr/bin/pdftotext', 'poppler-utils');

  startedPostgres = await startPostgres();
  database = await createTestDatabase();
  log(`test database ${database.name}`);

  const smtpPort = await freePort();
  const mailWebPort = await freePort();
  await startMaildev({ smtpPort, webPort: mailWebPort });

  const serverPort = await freePort();
  const env = {
    NODE_ENV: 'test',
    DATABASE_URL: database.url,
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(smtpPort),
    MAILDEV_API_URL: `http://127.0.0.1:${mailWebPort}`,
    LOG_LEVEL: 'warn',
  };
  const migrated = await run(
    process.execPath,
    [
      join(rootDir, 'node_modules', 'tsx', 'dist', 'cli.mjs'),
      join(rootDir, 'apps', 'server', 'src', 'db', 'migrate-cli.ts'),
    ],
    {
      env: { ...process.env, ...env },
    },
  );
  if (migrated.code !== 0) throw new Error('migrations failed');

  await buildWebIfStale();
  await startServer(
    {
      ...env,
      PORT: String(serverPort),
      WEB_DIST: webDist,
      APP_URL: `http://localhost:${serverPort}`,
    },
    { quiet: true },
  );

  mkdirSync(join(rootDir, '.data'), { recursive: true });
  rmSync(resultsFile, { force: true });
  const vitest = join(rootDir, 'node_modules', 'vitest', 'vitest.mjs');
  const { code } = await run(
    process.execPath,
    [
      vitest,
      'run',
      '--reporter=default',
      '--reporter=json',
      `--outputFile.json=${resultsFile}`,
      ...vitestArgs,
    ],
    {
      cwd: rootDir,
      stdio: ['ignore', 'inherit', 'inherit'],
      env: { ...process.env, ...env, E2E_BASE_URL: `http://localhost:${serverPort}` },
    },
  );
  return code;
}

let exitCode = 1;
const onSignal = () => {
  void cleanUp().finally(() => process.exit(130));
};
process.on('SIGINT', onSignal);
process.on('SIGTERM', onSignal);
try {
  exitCode = await main();
} catch (e) {
  log(`test run stopped: ${e instanceof Error ? e.message : String(e)}`);
  exitCode = 1;
}
await cleanUp();
const { passed, failed, skipped } = summarize();
if (exitCode !== 0 && failed === 0) exitCode = 1;
process.stdout.write(
  `${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}\n`,
);
process.exit(exitCode !== 0 || failed > 0 ? 1 : 0);
