import { readFileSync } from 'node:fs';
import { availableParallelism, loadavg } from 'node:os';
import { performance } from 'node:perf_hooks';
import { runAcSweep } from '../src/ac.ts';
import { solveOperatingPoint } from '../src/dc.ts';
import type { Circuit } from '../src/index.ts';
import { parseDeck } from '../src/index.ts';
import { acAmplifier, bjtAmplifier, diodeNetwork, ladder } from './circuits.ts';
import { ngspiceAvailable, ngspiceSecondsPerOp, ngspiceVersion } from './ngspice-loop.ts';

/**
 * `npm run bench -w packages/calc`: median time per bias point and per AC sweep, and the
 * engine's throughput against ngspice's batch loop on the same deck. Figures, not pass/fail:
 * BENCHMARKS.md records them with the machine they came from.
 * BENCH_N sets the number of solves in the side-by-side run (default 2000).
 */

const count = Number(process.env.BENCH_N ?? 2000);

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

// Side by side: N fresh solves of the amplifier with RC1 toggled, as ngspice's loop does.
const variants = [
  withResistor(amplifier, 'rc1', 10_000),
  withResistor(amplifier, 'rc1', 10_100),
] as const;
// Best of three runs, as for ngspice; every run's time includes the garbage collector's share.
const engineRun = (): number => {
  const start = performance.now();
  for (let i = 0; i < count; i += 1) solveOperatingPoint(variants[i % 2] ?? amplifier);
  return ((performance.now() - start) * 1000) / count;
};
const enginePerOp = Math.min(engineRun(), engineRun(), engineRun());
rows.push([`engine: ${count} fresh solves of the amplifier, per solve`, fmt(enginePerOp)]);
if (ngspiceAvailable()) {
  const ngspicePerOp = ngspiceSecondsPerOp(bjtAmplifier, 'rc1', [10_000, 10_100], count) * 1e6;
  rows.push([`ngspice: ${count} alter + op in one batch process, per op`, fmt(ngspicePerOp)]);
  rows.push([
    'throughput ratio, engine / ngspice batch loop',
    `${(ngspicePerOp / enginePerOp).toFixed(1)} ×`,
  ]);
} else {
  rows.push(['ngspice batch loop', 'not run: install Debian package ngspice']);
}

const width = Math.max(...rows.map(([label]) => label.length));
console.log(`Biasproof engine benchmark — ${machine()}`);
for (const [label, value] of rows) console.log(`${label.padEnd(width)}  ${value.padStart(12)}`);
