import { loadavg } from 'node:os';
import { monteCarloRows } from './monte-carlo.ts';

/** `npm run bench:mc -w packages/calc`: the Monte Carlo comparison alone (bench/run.ts includes it). */
const rows = monteCarloRows();
const width = Math.max(...rows.map(([label]) => label.length));
console.log(
  `Biasproof Monte Carlo benchmark — Node ${process.version}, load ${loadavg()[0]?.toFixed(2) ?? '?'}`,
);
for (const [label, value] of rows) console.log(`${label.padEnd(width)}  ${value.padStart(14)}`);
