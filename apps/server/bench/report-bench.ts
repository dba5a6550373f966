// The report goal of issue 8: a report of 10 pages or more in ≤ 2 s on this machine. Renders
// an invented record (sample-record.ts: a chain of common-emitter stages with findings and
// audit events) N times and prints the page count and the median time. Prints, asserts nothing.
//
//   npm run bench:report -w apps/server                 # 15 runs
//   npm run bench:report -w apps/server -- --runs 5 --out /tmp/sample-report.pdf
import { writeFileSync } from 'node:fs';
import { performance } from 'node:perf_hooks';
import { renderReport } from '../src/records/report/render-report.ts';
import { sampleRecord } from '../src/records/sample-record.ts';
import { appVersion } from '../src/version.ts';

function option(name: string, fallback: string): string {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 ? (process.argv[i + 1] ?? fallback) : fallback;
}

const runs = Number(option('runs', '15'));
const out = option('out', '');
const data = sampleRecord({ stages: 6, findings: 24, events: 120 });
const generation = { at: new Date(), by: 'Benchmark', appVersion };

// One warm-up run: fonts are read from disk and the JIT settles.
const first = await renderReport(data, { generation });
const pages = (first.toString('latin1').match(/\/Type \/Page\b/g) ?? []).length;
if (out) writeFileSync(out, first);

const times: number[] = [];
for (let i = 0; i < runs; i++) {
  const start = performance.now();
  await renderReport(data, { generation });
  times.push(performance.now() - start);
}
times.sort((a, b) => a - b);
const median = times[Math.floor(times.length / 2)]!;
console.log(
  `report: ${pages} pages, ${data.revision.draft.circuit.elements.length} elements, ` +
    `${data.findings.length} findings, ${data.auditEvents.length} audit events, ${(first.length / 1024).toFixed(0)} kB`,
);
console.log(
  `render: median ${median.toFixed(0)} ms over ${runs} runs (min ${times[0]!.toFixed(0)}, max ${times[times.length - 1]!.toFixed(0)}); goal ≤ 2000 ms`,
);
