import { parseDeck } from './src/deck-parse.ts';
import { runMonteCarlo } from './src/variation/monte-carlo.ts';
import { ceStage } from './bench/circuits.ts';
const circuit = parseDeck(ceStage).circuit;
const parameters = [
  ...['r1','r2','rc','re'].map((target) => ({ target, tolerancePercent: 1 })),
  { target: 'qn.bf', tolerancePercent: 30 },
];
runMonteCarlo({ circuit, parameters, samples: 5000, seed: 'w', probes: ['nodes.c'] });
const c0 = process.cpuUsage();
for (let k = 0; k < 5; k++) runMonteCarlo({ circuit, parameters, samples: 10000, seed: k, probes: ['nodes.c'] });
const c = process.cpuUsage(c0);
console.log('cpu per sample', ((c.user + c.system) / 50000).toFixed(2), 'µs');
