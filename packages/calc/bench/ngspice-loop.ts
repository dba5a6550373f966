import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/**
 * ngspice doing `count` operating points in one batch process: a `.control` loop that alters a
 * resistor and re-runs `op`, the fastest way a script can drive it. The process's start-up is
 * timed apart (a run with no loop) and taken off, so that the figure is the loop's throughput.
 */

export const ngspicePath = '/usr/bin/ngspice';

export function ngspiceAvailable(): boolean {
  return existsSync(ngspicePath);
}

/** The version line ngspice prints (`ngspice-39`), for the benchmark's header. */
export function ngspiceVersion(): string {
  const run = spawnSync(ngspicePath, ['-v'], { encoding: 'utf8', timeout: 10_000 });
  return /ngspice-[\w.]+/.exec(run.stdout)?.[0] ?? 'ngspice (version unknown)';
}

function timeRun(deck: string, resistor: string, values: [number, number], count: number): number {
  const dir = mkdtempSync(join(tmpdir(), 'biasproof-bench-'));
  try {
    const file = join(dir, 'loop.cir');
    const body = deck.replace(/^\.(op|ac|end)\b.*$/gim, '').trimEnd();
    // Two alters per pass, so every op solves a circuit different from the one before.
    const control = [
      '.control',
      'let i = 0',
      `while i < ${count / 2}`,
      `alter ${resistor} = ${values[0]}`,
      'op',
      `alter ${resistor} = ${values[1]}`,
      'op',
      // Dropping the two result plots keeps the loop's cost flat; without it ngspice slows as plots pile up.
      'destroy all',
      'let i = i + 1',
      'end',
      'quit 0',
      '.endc',
      '.end',
    ];
    writeFileSync(file, `${body}\n${control.join('\n')}\n`);
    const start = process.hrtime.bigint();
    const run = spawnSync(ngspicePath, ['-b', file], {
      cwd: dir,
      encoding: 'utf8',
      timeout: 600_000,
    });
    const seconds = Number(process.hrtime.bigint() - start) / 1e9;
    if (run.status !== 0)
      throw new Error(`ngspice failed: ${run.stderr}${run.stdout.slice(-2000)}`);
    return seconds;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** Seconds per operating point in ngspice's batch loop (best of `repeats`, start-up removed). */
export function ngspiceSecondsPerOp(
  deck: string,
  resistor: string,
  values: [number, number],
  count: number,
  repeats = 3,
): number {
  const best = (n: number): number =>
    Math.min(...Array.from({ length: repeats }, () => timeRun(deck, resistor, values, n)));
  return (best(count) - best(0)) / count;
}
