// A database and a maildev of a test's own. The server that `npm test` starts for the browser
// tests polls the run's shared outbox every 2 s and sends to the shared maildev; tests that
// must control when (and whether) messages go out, or stop the mail server, cannot share them.
import { spawn, type ChildProcess } from 'node:child_process';
import { createServer } from 'node:net';
import { join } from 'node:path';
import { createSequelize } from '../../db/connection.ts';
import { migrateToLatest } from '../../db/migrator.ts';
import { testEnv } from '../../test-support/test-env.ts';
import type { CapturedEmail } from '../../test-support/maildev.ts';

const rootDir = join(import.meta.dirname, '..', '..', '..', '..', '..');

/** A fresh, migrated database next to the run's one; drop() removes it. */
export async function createPrivateDatabase(): Promise<{ url: string; drop(): Promise<void> }> {
  const name = `biasproof_outbox_${Date.now().toString(36)}_${process.pid}`;
  const admin = createSequelize(testEnv.databaseUrl);
  await admin.query(`CREATE DATABASE "${name}"`);
  const url = testEnv.databaseUrl.replace(/\/[^/?]+(\?.*)?$/, `/${name}$1`);
  const own = createSequelize(url);
  await migrateToLatest(own);
  await own.close();
  return {
    url,
    async drop() {
      await admin.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
      await admin.close();
    },
  };
}

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      server.close(() => resolve(typeof address === 'object' && address ? address.port : 0));
    });
  });
}

/** maildev on ports of its own, which a test can stop and start again. */
export class OwnMaildev {
  private child: ChildProcess | null = null;
  constructor(
    readonly smtpPort: number,
    readonly webPort: number,
  ) {}

  static async create(): Promise<OwnMaildev> {
    return new OwnMaildev(await freePort(), await freePort());
  }

  async start(): Promise<void> {
    const bin = join(rootDir, 'node_modules', 'maildev', 'dist', 'bin', 'maildev.js');
    this.child = spawn(
      process.execPath,
      [
        bin,
        ...['--smtp', String(this.smtpPort), '--web', String(this.webPort)],
        ...['--ip', '127.0.0.1', '--web-ip', '127.0.0.1', '--silent'],
      ],
      { stdio: 'ignore' },
    );
    const deadline = Date.now() + 20_000;
    while (Date.now() < deadline) {
      if (
        await this.list().then(
          () => true,
          () => false,
        )
      )
        return;
      await new Promise((r) => setTimeout(r, 150));
    }
    throw new Error(`maildev did not answer on port ${this.webPort}`);
  }

  /** Stops the process this object started (by its pid) and waits until it has exited. */
  async stop(): Promise<void> {
    const child = this.child;
    this.child = null;
    if (!child || child.exitCode !== null) return;
    const exited = new Promise((r) => child.once('exit', r));
    child.kill('SIGTERM');
    await exited;
  }

  async list(): Promise<CapturedEmail[]> {
    const res = await fetch(`http://127.0.0.1:${this.webPort}/api/email`);
    if (!res.ok) throw new Error(`maildev answered ${res.status}`);
    return (await res.json()) as CapturedEmail[];
  }
}
