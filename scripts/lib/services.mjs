// The local services Biasproof needs: the project-local PostgreSQL cluster (docker-less-db/),
// maildev as the SMTP fake, and a few Debian packages the tests use.
import { existsSync } from 'node:fs';
import { createConnection } from 'node:net';
import { join } from 'node:path';
import { run, startChild } from './processes.mjs';

export const rootDir = join(import.meta.dirname, '..', '..');

export function log(message) {
  process.stdout.write(`[biasproof] ${message}\n`);
}

/** Starts PostgreSQL; resolves with true when this call started it (so the caller stops it). */
export async function startPostgres(env = process.env) {
  const { code, stdout } = await run('bash', [join(rootDir, 'docker-less-db', 'pg-start.sh')], {
    env,
  });
  if (code !== 0) throw new Error('PostgreSQL did not start (see the [db] lines above)');
  return stdout.trim().endsWith('started');
}

export async function stopPostgres(env = process.env) {
  await run('bash', [join(rootDir, 'docker-less-db', 'pg-stop.sh')], { env });
}

export function portIsFree(port, host = '127.0.0.1') {
  return new Promise((resolve) => {
    const socket = createConnection({ port, host });
    socket.once('connect', () => {
      socket.destroy();
      resolve(false);
    });
    socket.once('error', () => resolve(true));
  });
}

export async function waitFor(check, what, timeoutMs = 60_000) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (await check()) return;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`timed out waiting for ${what}`);
}

/** Starts maildev on loopback and waits until its REST API answers. */
export async function startMaildev({ smtpPort, webPort }) {
  for (const port of [smtpPort, webPort]) {
    if (!(await portIsFree(port))) {
      throw new Error(
        `port ${port} is taken; stop the program using it (maildev from another run?) and try again`,
      );
    }
  }
  const bin = join(rootDir, 'node_modules', 'maildev', 'dist', 'bin', 'maildev.js');
  const child = startChild(
    'mail',
    process.execPath,
    [
      bin,
      '--smtp',
      String(smtpPort),
      '--web',
      String(webPort),
      '--ip',
      '127.0.0.1',
      '--web-ip',
      '127.0.0.1',
      '--silent',
    ],
    { quiet: true },
  );
  await waitFor(async () => {
    try {
      const res = await fetch(`http://127.0.0.1:${webPort}/api/email`);
      return res.ok;
    } catch {
      return false;
    }
  }, `maildev on port ${webPort}`);
  return child;
}

/**
 * Installs a Debian package when its program is missing. As root it runs apt-get; otherwise it
 * says exactly what to run and fails, because the tests cannot pass without it.
 */
export async function ensureDebianPackage(program, pkg) {
  if (existsSync(program)) return;
  if (process.getuid?.() !== 0) {
    throw new Error(
      `${program} is missing. Install it once with: sudo apt-get update && sudo apt-get install -y ${pkg}`,
    );
  }
  log(`installing Debian package ${pkg} (for ${program})`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  let result = await run('apt-get', ['install', '-y', '-q', pkg], { env });
  if (result.code !== 0) {
    await run('apt-get', ['update', '-q'], { env });
    result = await run('apt-get', ['install', '-y', '-q', pkg], { env });
  }
  if (result.code !== 0 || !existsSync(program)) throw new Error(`could not install ${pkg}`);
}
