import { readFileSync } from 'node:fs';
import { availableParallelism, loadavg } from 'node:os';
import { performance } from 'node:perf_hooks';
import { runAcSweep } from '../src/ac.ts';
import {
  prepareOperatingPoint,
  solveOperatingPoint,
  solvePreparedOperatingPoint,
  withElementValue,
} from '../src/dc.ts';
import type { Circuit } from '../src/circuit.ts';
import type { OperatingPoint } from '../src/dc.ts';
import { parseDeck } from '../src/deck-parse.ts';
import { acAmplifier, bjtAmplifier, diodeNetwork, ladder } from './circuits.ts';
import { monteCarloRows } from './monte-carlo.ts';
import { ngspiceAvailable, ngspiceLoopRun, ngspiceVersion, type LoopRun } from './ngspice-loop.ts';

/**
 * `npm run bench -w packages/calc`: median time per bias point and per AC sweep, and the
 * engine's throughput against ngspice's batch loop on the same deck. Figures, not pass/fail:
 * BENCHMARKS.md records them with the machine they came from.
 * BENCH_N sets the number of solves in the side-by-side runs (default 2000), BENCH_ROUNDS the
 * number of turns they take (default 5). BENCHMARKS.md says exactly what each row measures.
 */

const count = Number(process.env.BENCH_N ?? 2000);
/** Turns of the side-by-side runs; each figure there is the best of its turns. */
const rounds = Number(process.env.BENCH_ROUNDS ?? 5);

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? (sorted[mid] ?? 0) : ((sorted[mid - 1] ?? 0) + (sorted[mid] ?? 0)) / 2;
}

/** Median µs of one call, after a warm-up that lets the JIT settle. */
function medianMicros(run: () => unknown, samples: number): number {
  for (let i = 0; i < Math.min(200, samples); i += 1) run();
  const times: number[] = [];
  for (let i = 0; i < samples; i += 1) {
    const start = performance.now();
    run();
    times.push((performance.now() - start) * 1000);
  }
  return median(times);
}

/** The circuit with one resistor's value replaced, so that consecutive solves differ. */
function withResistor(circuit: Circuit, name: string, value: number): Circuit {
  return {
    ...circuit,
    elements: circuit.elements.map((e) =>
      e.kind === 'R' && e.name.toLowerCase() === name ? { ...e, value } : e,
    ),
  };
}

function machine(): string {
  let cpu = 'unknown CPU';
  try {
    cpu =
      /^model name\s*:\s*(.+)$/m.exec(readFileSync('/proc/cpuinfo', 'utf8'))?.[1]?.trim() ?? cpu;
  } catch {
    // Not Linux: the CPU model stays unknown.
  }
  const reference = ngspiceAvailable() ? `, ${ngspiceVersion()}` : '';
  // Load average: figures taken on a busy machine read slower, and say so.
  return `${availableParallelism()} × ${cpu}, Node ${process.version}${reference}, load ${loadavg()[0]?.toFixed(2) ?? '?'}`;
}

const rows: [string, string][] = [];
const fmt = (us: number): string => `${us.toFixed(1)} µs`;

const diodes = parseDeck(diodeNetwork).circuit;
const amplifier = parseDeck(bjtAmplifier).circuit;
const ladderCircuit = parseDeck(ladder()).circuit;
const ac = parseDeck(acAmplifier);
const sweep = ac.directives.ac;
if (!sweep) throw new Error('the AC benchmark deck has no .ac card');

rows.push([
  'bias point, 5-node diode network (median)',
  fmt(medianMicros(() => solveOperatingPoint(diodes), 5000)),
]);
rows.push([
  'bias point, 10-device BJT amplifier (median)',
  fmt(medianMicros(() => solveOperatingPoint(amplifier), 5000)),
]);
rows.push([
  'bias point, 50-device ladder (median)',
  fmt(medianMicros(() => solveOperatingPoint(ladderCircuit), 1000)),
]);
rows.push([
  `AC sweep, ${sweep.points} points, CE amplifier (median)`,
  fmt(medianMicros(() => runAcSweep(ac.circuit, { sweep, probe: 'out' }), 500)),
]);

// Side by side with ngspice's loop: N solves of the amplifier with RC1 toggled between two values,
// every solve starting from the initial guess (no reuse of the previous answer).
const rc1Values: [number, number] = [10_000, 10_100];
/** µs per solve over N solves, wall time including the run's garbage collection. */
function loopMicros(solve: (i: number) => unknown): number {
  const start = performance.now();
  for (let i = 0; i < count; i += 1) solve(i);
  return ((performance.now() - start) * 1000) / count;
}
// Fresh: every solve gets a new circuit object (validation, compilation, Newton, result).
const variants = rc1Values.map((value) => withResistor(amplifier, 'rc1', value));
const fresh = (i: number): OperatingPoint => solveOperatingPoint(variants[i % 2] ?? amplifier);
// Prepared: validated and compiled once; each solve first alters RC1 in the prepared circuit,
// as ngspice's `alter` does in its parsed one.
const prepared = prepareOperatingPoint(amplifier);
const alterAndSolve = (i: number): OperatingPoint =>
  solvePreparedOperatingPoint(withElementValue(prepared, 'rc1', rc1Values[i % 2] ?? 10_000));
rows.push([
  'bias point, 10-device BJT amplifier, alter + prepared solve (median)',
  fmt(medianMicros(() => alterAndSolve(0), 5000)),
]);

// The runs take turns (engine, engine, ngspice, ngspice start-up) so that on a shared machine
// each sees the same load; every figure is the best of its runs.
const withNgspice = ngspiceAvailable();
const freshRuns: number[] = [];
const preparedRuns: number[] = [];
const loopRuns: LoopRun[] = [];
const startUpRuns: number[] = [];
for (let round = 0; round < rounds; round += 1) {
  freshRuns.push(loopMicros(fresh));
  preparedRuns.push(loopMicros(alterAndSolve));
  if (!withNgspice) continue;
  loopRuns.push(ngspiceLoopRun(bjtAmplifier, 'rc1', rc1Values, count));
  startUpRuns.push(ngspiceLoopRun(bjtAmplifier, 'rc1', rc1Values, 0).seconds);
}
const freshPerSolve = Math.min(...freshRuns);
const preparedPerSolve = Math.min(...preparedRuns);
rows.push([`engine: ${count} fresh solves of new circuits, per solve`, fmt(freshPerSolve)]);
rows.push([`engine: ${count} alter + prepared solve, per solve`, fmt(preparedPerSolve)]);
if (withNgspice) {
  const startUp = Math.min(...startUpRuns);
  const perOp = ((Math.min(...loopRuns.map((r) => r.seconds)) - startUp) / count) * 1e6;
  const analysisPerOp = (Math.min(...loopRuns.map((r) => r.analysisSeconds)) / count) * 1e6;
  const ratio = (engine: number, reference: number): string =>
    `${(reference / engine).toFixed(1)} ×`;
  rows.push([`ngspice: ${count} alter + op in one batch process, per op`, fmt(perOp)]);
  rows.push(["ngspice: its own analysis time ('rusage time'), per op", fmt(analysisPerOp)]);
  rows.push([
    'throughput ratio, alter + prepared solve / ngspice alter + op (goal)',
    ratio(preparedPerSolve, perOp),
  ]);
  rows.push(['throughput ratio, fresh solve / ngspice alter + op', ratio(freshPerSolve, perOp)]);
  rows.push([
    'time ratio, ngspice analysis time / alter + prepared solve',
    ratio(preparedPerSolve, analysisPerOp),
  ]);
} else {
  rows.push(['ngspice batch loop', 'not run: install Debian package ngspice']);
}

// Monte Carlo of a CE stage against ngspice's alter/altermod/op loop (bench/monte-carlo.ts).
rows.push(...monteCarloRows());

const width = Math.max(...rows.map(([label]) => label.length));
console.log(`Biasproof engine benchmark — ${machine()}`);
for (const [label, value] of rows) console.log(`${label.padEnd(width)}  ${value.padStart(12)}`);
