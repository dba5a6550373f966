// Starts the API server (which also serves the built web app) as a child process.
import { join } from 'node:path';
import { startChild } from './processes.mjs';
import { rootDir, waitFor } from './services.mjs';

export async function startServer(env, { quiet = false } = {}) {
  const tsx = join(rootDir, 'node_modules', 'tsx', 'dist', 'cli.mjs');
  const child = startChild(
    'server',
    process.execPath,
    [tsx, join(rootDir, 'apps', 'server', 'src', 'main.ts')],
    {
      env: { ...process.env, ...env },
      cwd: rootDir,
      quiet,
    },
  );
  let exited = false;
  child.once('exit', () => (exited = true));
  await waitFor(
    async () => {
      if (exited)
        throw new Error('the server exited during start-up (see the [server] lines above)');
      try {
        const res = await fetch(`http://127.0.0.1:${env.PORT}/api/health`);
        return res.status === 200;
      } catch {
        return false;
      }
    },
    `the server on port ${env.PORT}`,
    90_000,
  );
  return child;
}
