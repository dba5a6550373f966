import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { cornersReport, mcReport } from '../src/cli-report.ts';
import { parseDeck } from '../src/deck-parse.ts';
import { runCorners } from '../src/variation/corners.ts';
import { runMonteCarlo } from '../src/variation/monte-carlo.ts';

// `biasproof mc` and `biasproof corners` as a script runs them: a separate process through the
// package's bin, a deck file, JSON on stdout. The in-process functions are the reference; the
// divider's corners are checked against the hand calculation as well.

const calcRoot = join(import.meta.dirname, '..');
const bin = join(calcRoot, 'bin', 'biasproof.mjs');
const ceDeck = join(import.meta.dirname, 'decks', 'q-npn-ce.cir');
const work = mkdtempSync(join(tmpdir(), 'biasproof-variation-cli-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

function biasproof(...args: string[]) {
  const run = spawnSync(process.execPath, [bin, ...args], {
    cwd: calcRoot,
    encoding: 'utf8',
    timeout: 120_000,
  });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}

const tolArgs = [
  '--tol',
  'r1=1%',
  '--tol',
  'r2=1%',
  '--tol',
  'RC=1%',
  '--tol',
  're=1%',
  '--tol',
  'qn2.bf=30%',
];
const parameters = [
  { target: 'r1', tolerancePercent: 1 },
  { target: 'r2', tolerancePercent: 1 },
  { target: 'RC', tolerancePercent: 1 },
  { target: 're', tolerancePercent: 1 },
  { target: 'qn2.bf', tolerancePercent: 30 },
];
const circuit = parseDeck(readFileSync(ceDeck, 'utf8')).circuit;

describe('biasproof mc', () => {
  it('prints exactly samples, failed, mean, sigma, min, max, p00135, p50, p99865 — the numbers of runMonteCarlo', () => {
    const run = biasproof(
      'mc',
      ceDeck,
      '--samples',
      '2000',
      '--seed',
      '42',
      '--probe',
      'devices.q1.ic',
      ...tolArgs,
    );
    expect(run.status).toBe(0);
    const out = JSON.parse(run.stdout) as Record<string, number>;
    expect(Object.keys(out)).toEqual([
      'samples',
      'failed',
      'mean',
      'sigma',
      'min',
      'max',
      'p00135',
      'p50',
      'p99865',
    ]);
    const reference = runMonteCarlo({
      circuit,
      parameters,
      samples: 2000,
      seed: '42',
      probes: ['devices.q1.ic'],
    });
    expect(out).toEqual(mcReport(reference, 'devices.q1.ic'));
    expect([out.samples, out.failed]).toEqual([2000, 0]);
  });

  it('when run twice with the same seed, then it prints the same bytes', () => {
    const args = [
      'mc',
      ceDeck,
      '--samples',
      '500',
      '--seed',
      'repeat',
      '--probe',
      'nodes.c',
      ...tolArgs,
    ];
    expect(biasproof(...args).stdout).toBe(biasproof(...args).stdout);
  });
});

describe('biasproof corners', () => {
  it('prints exactly min, max, minAt and maxAt — the numbers of runCorners', () => {
    const run = biasproof('corners', ceDeck, '--probe', 'devices.q1.ic', ...tolArgs);
    expect(run.status).toBe(0);
    const out = JSON.parse(run.stdout) as { minAt: Record<string, number> };
    expect(Object.keys(out)).toEqual(['min', 'max', 'minAt', 'maxAt']);
    expect(Object.keys(out.minAt)).toEqual(['r1', 'r2', 'rc', 're', 'qn2.bf']);
    expect(out).toEqual(
      cornersReport(
        runCorners({ circuit, parameters, probes: ['devices.q1.ic'] }),
        'devices.q1.ic',
      ),
    );
  });

  it('a divider: min and max of V(out) are the hand-calculated 12·3.135/11.745 V and 12·3.465/11.255 V', () => {
    const file = join(work, 'divider.cir');
    writeFileSync(file, 'divider\nV1 in 0 12\nR1 in out 8.2k\nR2 out 0 3.3k\n.end\n');
    const out = JSON.parse(
      biasproof('corners', file, '--probe', 'nodes.out', '--tol', 'r1=5%', '--tol', 'r2=5%').stdout,
    ) as {
      min: number;
      max: number;
      minAt: Record<string, number>;
      maxAt: Record<string, number>;
    };
    expect(out.min).toBeCloseTo((12 * 3135) / 11745, 10);
    expect(out.max).toBeCloseTo((12 * 3465) / 11255, 10);
    expect(out.minAt).toEqual({ r1: expect.closeTo(8610, 8), r2: expect.closeTo(3135, 8) });
    expect(out.maxAt).toEqual({ r1: expect.closeTo(7790, 8), r2: expect.closeTo(3465, 8) });
  });
});

describe('biasproof mc and corners: bad input exits 2 with one line on stderr', () => {
  const base = ['--probe', 'nodes.c', '--tol', 'r1=1%'];
  const cases: [what: string, args: string[], message: RegExp][] = [
    [
      'mc without --samples',
      ['mc', ceDeck, '--seed', '1', ...base],
      /^biasproof: mc needs --samples N/,
    ],
    [
      'mc without --seed',
      ['mc', ceDeck, '--samples', '10', ...base],
      /^biasproof: mc needs --seed S/,
    ],
    [
      'more than 100 000 samples',
      ['mc', ceDeck, '--samples', '100001', '--seed', '1', ...base],
      /^biasproof: Monte Carlo samples: samples must be at most 100000$/,
    ],
    [
      'a samples count that is not a number',
      ['mc', ceDeck, '--samples', 'many', '--seed', '1', ...base],
      /^biasproof: --samples needs a whole number, not 'many'/,
    ],
    [
      'corners without --tol',
      ['corners', ceDeck, '--probe', 'nodes.c'],
      /^biasproof: corners needs at least one --tol NAME=P%/,
    ],
    [
      'corners without --probe',
      ['corners', ceDeck, '--tol', 'r1=1%'],
      /^biasproof: corners needs --probe PATH/,
    ],
    [
      'a malformed --tol',
      ['corners', ceDeck, '--probe', 'nodes.c', '--tol', 'r1:1%'],
      /^biasproof: --tol 'r1:1%': expected NAME=P%, e.g. r1=1% or qn.bf=30%$/,
    ],
    [
      'an unknown element in --tol',
      ['corners', ceDeck, '--probe', 'nodes.c', '--tol', 'r9=1%'],
      /^biasproof: varied parameter r9: no element of that name is in the circuit/,
    ],
    [
      'an unknown model parameter in --tol',
      ['corners', ceDeck, '--probe', 'nodes.c', '--tol', 'qn2.hfe=5%'],
      /^biasproof: model qn2 has no parameter HFE that the engine evaluates/,
    ],
    [
      'an unknown result path',
      ['corners', ceDeck, '--probe', 'nodes.x', '--tol', 'r1=1%'],
      /^biasproof: result path 'nodes.x': node x is not in the circuit/,
    ],
  ];
  it.each(cases)('%s', (_what, args, message) => {
    const run = biasproof(...args);
    expect(run.status).toBe(2);
    expect(run.stdout).toBe('');
    expect(run.stderr.trimEnd().split('\n')).toHaveLength(1);
    expect(run.stderr.trimEnd()).toMatch(message);
  });
});
