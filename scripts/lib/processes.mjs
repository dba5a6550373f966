// Child processes that belong to a run of `npm start` or `npm test`: each one in its own
// process group so that stopping it also stops whatever it spawned (tsx, vite, workers).
import { spawn } from 'node:child_process';

const children = new Set();

/** Starts a long-running child; its output is prefixed with the label. */
export function startChild(label, command, args, options = {}) {
  const child = spawn(command, args, {
    stdio: ['ignore', 'pipe', 'pipe'],
    detached: true,
    ...options,
  });
  const quiet = options.quiet ?? false;
  const prefix = (stream, out) =>
    stream.on('data', (chunk) => {
      if (quiet) return;
      for (const line of String(chunk).split('\n'))
        if (line.trim()) out.write(`[${label}] ${line}\n`);
    });
  prefix(child.stdout, process.stdout);
  prefix(child.stderr, process.stderr);
  children.add(child);
  child.on('exit', () => children.delete(child));
  return child;
}

/** Sends SIGTERM to a child's group and waits (then SIGKILL after the grace period). */
export async function stopChild(child, graceMs = 8000) {
  if (child.exitCode !== null || child.signalCode !== null) return;
  const exited = new Promise((resolve) => child.once('exit', resolve));
  try {
    process.kill(-child.pid, 'SIGTERM');
  } catch {
    return;
  }
  const timer = setTimeout(() => {
    try {
      process.kill(-child.pid, 'SIGKILL');
    } catch {
      /* already gone */
    }
  }, graceMs);
  await exited;
  clearTimeout(timer);
}

export async function stopAllChildren() {
  await Promise.all([...children].map((c) => stopChild(c)));
}

/** Runs a command to completion; resolves with its exit code and captured stdout. */
export function run(command, args, options = {}) {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { stdio: ['ignore', 'pipe', 'inherit'], ...options });
    let stdout = '';
    child.stdout?.on('data', (c) => {
      stdout += String(c);
      if (options.echo) process.stdout.write(c);
    });
    child.on('error', reject);
    child.on('exit', (code) => resolve({ code: code ?? 1, stdout }));
  });
}
