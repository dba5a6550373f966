import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/**
 * ngspice doing `count` operating points in one batch process: a `.control` loop that alters a
 * resistor and re-runs `op`, the fastest way a script can drive it. The caller times the
 * process's start-up apart (a run with count 0) and takes it off, so that the figure is the
 * loop's throughput. ngspice's own account of the time spent in its analysis (`rusage time`)
 * comes from the same run: it leaves out the control language, the alters and the result plots.
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

export interface LoopRun {
  /** Wall time of the whole process, s. */
  seconds: number;
  /** ngspice's "Total analysis time", s. */
  analysisSeconds: number;
}

/** One ngspice process running the loop `count` times (0: start-up and parsing only). */
export function ngspiceLoopRun(
  deck: string,
  resistor: string,
  values: [number, number],
  count: number,
): LoopRun {
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
      'rusage time',
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
    const analysis = /Total analysis time \(seconds\) = ([\d.eE+-]+)/.exec(run.stdout);
    return { seconds, analysisSeconds: analysis ? Number(analysis[1]) : NaN };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
