import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { parseDeck } from '../src/deck-parse.ts';
import { runMonteCarlo } from '../src/variation/monte-carlo.ts';
import { ceStage } from './circuits.ts';
import { ngspiceAvailable, ngspicePath } from './ngspice-loop.ts';

/**
 * Monte Carlo of the CE stage (R1, R2, RC, RE ±1 %, BF ±30 %, each 3σ of a normal), N samples
 * (BENCH_MC_N, default 10 000), side by side with ngspice doing the same: one batch process whose
 * `.control` loop draws each value with `sgauss(0)`, `alter`s the four resistors, `altermod`s BF,
 * runs `op` and stores V(c). Rounds (BENCH_MC_ROUNDS, default 5) take turns — engine, ngspice,
 * ngspice start-up — so that a shared machine loads both alike; the figures are the medians.
 * ngspice's time is its wall time less that of the same process with no loop (start-up and
 * parsing); the engine's is the whole runMonteCarlo call (validation, compilation, sampling,
 * solves, statistics and histogram).
 */

const samples = Number(process.env.BENCH_MC_N ?? 10_000);
const rounds = Number(process.env.BENCH_MC_ROUNDS ?? 5);
const resistors: [string, number][] = [
  ['r1', 56e3],
  ['r2', 12e3],
  ['rc', 3.9e3],
  ['re', 1e3],
];
const parameters = [
  ...resistors.map(([target]) => ({ target, tolerancePercent: 1 })),
  { target: 'qn.bf', tolerancePercent: 30 },
];

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
}

const gnuTime = '/usr/bin/time';

/** One ngspice process drawing and solving `count` samples: wall and CPU time in s, V(c)'s mean and σ. */
function ngspiceRun(count: number): { seconds: number; cpu: number; mean: number; sigma: number } {
  const dir = mkdtempSync(join(tmpdir(), 'biasproof-bench-mc-'));
  try {
    const body = ceStage.replace(/^\.(op|end)\b.*$/gim, '').trimEnd();
    const control = [
      '.control',
      'setplot const',
      `let acc = vector(${Math.max(count, 1)})`,
      'let i = 0',
      `while i < ${count}`,
      ...resistors.map(([name, value]) => `alter ${name} = ${value}*(1 + 0.01/3*sgauss(0))`),
      'altermod qn bf = 180*(1 + 0.3/3*sgauss(0))',
      'op',
      'let const.acc[const.i] = v(c)',
      // Dropping each op's plot keeps the loop's cost flat (see ngspice-loop.ts).
      'destroy all',
      'setplot const',
      'let i = i + 1',
      'end',
      'let m = mean(acc)',
      'let sd = sqrt(mean((acc - m)^2))',
      'print m sd',
      'quit 0',
      '.endc',
      '.end',
    ];
    const file = join(dir, 'mc.cir');
    writeFileSync(file, `${body}\n${control.join('\n')}\n`);
    // GNU time (Debian package `time`) adds the child's CPU time; the wall time is taken here.
    const timed = existsSync(gnuTime);
    const cpuFile = join(dir, 'cpu.txt');
    const [command, args] = timed
      ? [gnuTime, ['-f', '%U %S', '-o', cpuFile, ngspicePath, '-b', file]]
      : [ngspicePath, ['-b', file]];
    const start = process.hrtime.bigint();
    const run = spawnSync(command, args, {
      cwd: dir,
      encoding: 'utf8',
      timeout: 1_800_000,
    });
    const seconds = Number(process.hrtime.bigint() - start) / 1e9;
    if (run.status !== 0)
      throw new Error(`ngspice failed: ${run.stderr}${run.stdout.slice(-2000)}`);
    const read = (name: string): number =>
      Number(new RegExp(`^${name} = (\\S+)`, 'm').exec(run.stdout)?.[1]);
    const cpu = timed
      ? readFileSync(cpuFile, 'utf8')
          .trim()
          .split(/\s+/)
          .map(Number)
          .reduce((a, b) => a + b, 0)
      : NaN;
    return { seconds, cpu, mean: read('m'), sigma: read('sd') };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

const ms = (seconds: number): string => `${(seconds * 1000).toFixed(0)} ms`;
const perSample = (seconds: number): string => `${((seconds / samples) * 1e6).toFixed(1)} µs`;
const cpuNow = (): number => {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1e6;
};

/** Rows of the Monte Carlo comparison, for bench/run.ts's table. */
export function monteCarloRows(): [string, string][] {
  const circuit = parseDeck(ceStage).circuit;
  const engineWall: number[] = [];
  const engineCpu: number[] = [];
  const loops: ReturnType<typeof ngspiceRun>[] = [];
  const startUps: ReturnType<typeof ngspiceRun>[] = [];
  let engineStats = { mean: NaN, sigma: NaN, failed: 0 };
  // A first, untimed run lets the JIT settle as it would in a long-lived worker.
  runMonteCarlo({ circuit, parameters, samples: 2000, seed: 'warm-up', probes: ['nodes.c'] });
  for (let round = 0; round < rounds; round++) {
    const cpu = cpuNow();
    const start = performance.now();
    const r = runMonteCarlo({ circuit, parameters, samples, seed: round, probes: ['nodes.c'] });
    engineWall.push((performance.now() - start) / 1000);
    engineCpu.push(cpuNow() - cpu);
    const s = r.probes['nodes.c']!.statistics;
    engineStats = { mean: s.mean, sigma: s.sigma, failed: r.failed };
    if (!ngspiceAvailable()) continue;
    loops.push(ngspiceRun(samples));
    startUps.push(ngspiceRun(0));
  }
  const wall = median(engineWall);
  const cpu = median(engineCpu);
  const rows: [string, string][] = [
    [`Monte Carlo, CE stage, ${samples} samples, engine wall (median of ${rounds})`, ms(wall)],
    ['  engine wall, per sample', perSample(wall)],
    ['  engine CPU time (median), per sample', `${ms(cpu)}, ${perSample(cpu)}`],
    ['  engine wall runs', engineWall.map(ms).join(' / ')],
    [
      '  engine V(c): mean, σ, failed',
      `${engineStats.mean.toFixed(4)} V, ${(engineStats.sigma * 1000).toFixed(2)} mV, ${engineStats.failed}`,
    ],
  ];
  if (!ngspiceAvailable())
    return [...rows, ['ngspice Monte Carlo loop', 'not run: install Debian package ngspice']];
  const ngWall = median(loops.map((l) => l.seconds)) - median(startUps.map((l) => l.seconds));
  const ngCpu = median(loops.map((l) => l.cpu)) - median(startUps.map((l) => l.cpu));
  const last = loops[loops.length - 1]!;
  rows.push(
    [
      `  ngspice: ${samples} × (4 alter + altermod + op), one batch process, wall (median)`,
      ms(ngWall),
    ],
    ['  ngspice wall, per sample', perSample(ngWall)],
    ['  ngspice CPU time (median), per sample', `${ms(ngCpu)}, ${perSample(ngCpu)}`],
    ['  ngspice wall runs (start-up not taken off)', loops.map((l) => ms(l.seconds)).join(' / ')],
    ['  ngspice start-up, wall (median)', ms(median(startUps.map((l) => l.seconds)))],
    ['  ngspice V(c): mean, σ', `${last.mean.toFixed(4)} V, ${(last.sigma * 1000).toFixed(2)} mV`],
    ['  throughput ratio, wall, engine / ngspice (goal ≥ 20 ×)', `${(ngWall / wall).toFixed(1)} ×`],
    ['  throughput ratio, CPU time, engine / ngspice', `${(ngCpu / cpu).toFixed(1)} ×`],
  );
  return rows;
}
