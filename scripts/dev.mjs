// `npm run dev`: PostgreSQL and maildev as for `npm start`, then the server with reload
// (tsx watch) on :3000 and Vite with hot module replacement on :5173, which proxies /api.
import { join } from 'node:path';
import { run, startChild, stopAllChildren } from './lib/processes.mjs';
import { log, rootDir, startMaildev, startPostgres, stopPostgres } from './lib/services.mjs';

let startedPostgres = false;
async function stopEverything(code) {
  await stopAllChildren();
  if (startedPostgres) await stopPostgres();
  process.exit(code);
}
process.on('SIGINT', () => void stopEverything(0));
process.on('SIGTERM', () => void stopEverything(0));

try {
  startedPostgres = await startPostgres();
  const tsx = join(rootDir, 'node_modules', 'tsx', 'dist', 'cli.mjs');
  const seeded = await run(process.execPath, [tsx, join(rootDir, 'seed', 'src', 'load-demo.ts')]);
  if (seeded.code !== 0) throw new Error('loading the demo data failed');
  await startMaildev({ smtpPort: 1025, webPort: 1080 });
  startChild(
    'server',
    process.execPath,
    [tsx, 'watch', '--clear-screen=false', join(rootDir, 'apps', 'server', 'src', 'main.ts')],
    {
      cwd: rootDir,
      env: { ...process.env, LOG_LEVEL: process.env.LOG_LEVEL ?? 'info' },
    },
  );
  startChild('web', 'npm', ['run', 'dev', '-w', 'apps/web'], { cwd: rootDir });
  log('web (HMR) http://localhost:5173   api http://localhost:3000   mail http://localhost:1080');
} catch (e) {
  log(`could not start: ${e instanceof Error ? e.message : String(e)}`);
  await stopEverything(1);
}
