import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { solveOperatingPoint } from '../src/dc.ts';
import { parseDeck } from '../src/index.ts';

// The `biasproof` command as a script outside the engine runs it: a separate process started
// through the package's bin, reading deck files, answering JSON on stdout and an exit status.

const calcRoot = join(import.meta.dirname, '..');
const repoRoot = join(calcRoot, '..', '..');
const bin = join(calcRoot, 'bin', 'biasproof.mjs');
const deckDir = join(import.meta.dirname, 'decks');
const work = mkdtempSync(join(tmpdir(), 'biasproof-cli-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

function biasproof(...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const run = spawnSync(process.execPath, [bin, ...args], {
    cwd: repoRoot,
    encoding: 'utf8',
    timeout: 60_000,
  });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}

function tempDeck(name: string, text: string): string {
  const file = join(work, name);
  writeFileSync(file, text);
  return file;
}

const deck = (file: string): string => join(deckDir, file);

describe('biasproof op', () => {
  it('prints nodes, sources and diode id vd rd as JSON, the same numbers as solveOperatingPoint', () => {
    const run = biasproof('op', deck('d-series.cir'));
    expect(run.status).toBe(0);
    const out = JSON.parse(run.stdout) as {
      nodes: Record<string, number>;
      sources: Record<string, number>;
      devices: Record<string, Record<string, unknown>>;
    };
    const op = solveOperatingPoint(parseDeck(readFileSync(deck('d-series.cir'), 'utf8')).circuit);
    expect(out.nodes).toEqual(op.nodes);
    expect(Object.keys(out.nodes).sort()).toEqual(['a', 'in']);
    expect(out.sources).toEqual({ v1: op.sources.v1 });
    expect(Object.keys(out.devices.d1 ?? {})).toEqual(['kind', 'region', 'id', 'vd', 'rd']);
    expect(out.devices.d1).toMatchObject({ kind: 'D', region: 'forward' });
  });

  it('prints BJT ic ib vbe vce gm rpi ro and MOSFET id vgs vds gm gmb ro with their regions', () => {
    const bjt = JSON.parse(biasproof('op', deck('q-npn-ce.cir')).stdout) as {
      devices: Record<string, Record<string, unknown>>;
    };
    expect(Object.keys(bjt.devices.q1 ?? {})).toEqual([
      'kind',
      'region',
      'ic',
      'ib',
      'vbe',
      'vce',
      'gm',
      'rpi',
      'ro',
    ]);
    expect(bjt.devices.q1).toMatchObject({ kind: 'Q', region: 'active' });
    const mos = JSON.parse(biasproof('op', deck('m-cs.cir')).stdout) as {
      devices: Record<string, Record<string, unknown>>;
    };
    expect(Object.keys(mos.devices.m1 ?? {})).toEqual([
      'kind',
      'region',
      'id',
      'vgs',
      'vds',
      'gm',
      'gmb',
      'ro',
    ]);
    expect(mos.devices.m1).toMatchObject({ kind: 'M', region: 'saturation' });
  });

  it('lowercases names and prints an infinite ro (LAMBDA=0 in saturation) as null, keeping the JSON valid', () => {
    const file = tempDeck(
      'lambda0.cir',
      'No channel-length modulation\nVDD VDD 0 5\nVG G 0 1.5\nRD VDD D 10K\nM1 D G 0 0 NIDEAL W=10U L=1U\n.MODEL NIDEAL NMOS (VTO=0.7 KP=50U)\n.END\n',
    );
    const run = biasproof('op', file);
    expect(run.status).toBe(0);
    expect(run.stdout).toMatch(/"ro": null/);
    const out = JSON.parse(run.stdout) as {
      nodes: Record<string, number>;
      sources: Record<string, number>;
      devices: Record<string, Record<string, unknown>>;
    };
    expect(Object.keys(out.nodes).sort()).toEqual(['d', 'g', 'vdd']);
    expect(Object.keys(out.sources).sort()).toEqual(['vdd', 'vg']);
    expect(out.devices.m1).toMatchObject({ region: 'saturation', ro: null });
  });

  it('lists the deck warnings on stderr and leaves stdout pure JSON; --quiet drops them', () => {
    const file = tempDeck('warn.cir', 'warn\nV1 a 0 1\nR1 a 0 1k\n.options reltol=1e-4\n.end\n');
    const run = biasproof('op', file);
    expect(run.status).toBe(0);
    expect(run.stderr).toBe(
      'biasproof: warning: line 4: .options: simulator options do not apply to the engine; ignored\n',
    );
    expect(() => JSON.parse(run.stdout) as unknown).not.toThrow();
    expect(biasproof('op', file, '--quiet').stderr).toBe('');
  });

  it('works through npx from the repository root', () => {
    const run = spawnSync('npx', ['--no-install', 'biasproof', 'op', deck('d-series.cir')], {
      cwd: repoRoot,
      encoding: 'utf8',
      timeout: 60_000,
    });
    expect(run.status).toBe(0);
    expect(JSON.parse(run.stdout)).toHaveProperty('devices.d1.kind', 'D');
  });
});

describe('biasproof ac', () => {
  it("runs the deck's .ac sweep and prints freq, db and deg arrays", () => {
    const run = biasproof('ac', deck('ac-rc-lowpass.cir'), '--probe', 'OUT');
    expect(run.status).toBe(0);
    const out = JSON.parse(run.stdout) as { freq: number[]; db: number[]; deg: number[] };
    expect(Object.keys(out)).toEqual(['freq', 'db', 'deg']);
    // .ac dec 20 1 1meg: 6 decades at 20 points each, both ends included.
    expect(out.freq).toHaveLength(121);
    expect(out.db).toHaveLength(121);
    expect(out.deg).toHaveLength(121);
    expect(out.freq[0]).toBe(1);
    expect(out.db[0]).toBeCloseTo(0, 3);
    expect(out.deg.at(-1)).toBeLessThan(-170);
  });
});

describe('biasproof ac --ref', () => {
  it('prints the response of V(probe) − V(ref): out against a of the two-section filter', () => {
    const run = biasproof('ac', deck('ac-rc-lowpass.cir'), '--probe', 'out', '--ref', 'a');
    expect(run.status).toBe(0);
    const out = JSON.parse(run.stdout) as { freq: number[]; db: number[] };
    const plain = JSON.parse(
      biasproof('ac', deck('ac-rc-lowpass.cir'), '--probe', 'out').stdout,
    ) as { db: number[] };
    // At 1 Hz V(out) ≈ V(a) ≈ 1 V, so the difference is far below the plain response.
    expect(out.db[0]).toBeLessThan((plain.db[0] ?? 0) - 40);
  });
});

describe('biasproof: bad input exits 2 with one line on stderr', () => {
  const cases: [what: string, args: () => string[], message: RegExp][] = [
    [
      'a missing deck file',
      () => ['op', join(work, 'nope.cir')],
      /^biasproof: cannot read deck '.*nope\.cir': no such file$/,
    ],
    [
      'a bad deck',
      () => ['op', tempDeck('bad.cir', 'bad\nV1 a 0 1\nR1 a 0 4x7\n')],
      /^biasproof: line 3: resistance of R1: '4x7' is not a value/,
    ],
    [
      'an unsolvable circuit',
      () => ['op', tempDeck('loop.cir', 'loop\nV1 a 0 1\nV2 a 0 2\nR1 a 0 1k\n')],
      /^biasproof: .*(v1|v2|V1|V2)/,
    ],
    [
      'a deck without .ac',
      () => ['ac', deck('d-series.cir'), '--probe', 'a'],
      /^biasproof: deck '.*' has no \.ac card to run/,
    ],
    [
      'an unknown probe node',
      () => ['ac', deck('ac-rc-lowpass.cir'), '--probe', 'nowhere'],
      /^biasproof: probe node 'nowhere' is not in the deck/,
    ],
    [
      'ac without --probe',
      () => ['ac', deck('ac-rc-lowpass.cir')],
      /^biasproof: ac needs --probe NODE/,
    ],
    [
      'an unknown command',
      () => ['tran', deck('d-series.cir')],
      /^biasproof: unknown command 'tran'; expected op, ac, mc or corners/,
    ],
    [
      'an unknown option',
      () => ['op', deck('d-series.cir'), '--fast'],
      /^biasproof: unknown option --fast/,
    ],
    ['a missing deck argument', () => ['op'], /^biasproof: op needs a DECK file/],
    [
      'no arguments at all',
      () => [],
      /^biasproof: no command given; expected op, ac, mc or corners \(see biasproof --help\)$/,
    ],
    [
      'a bad --temp value',
      () => ['op', deck('d-series.cir'), '--temp', 'warm'],
      /^biasproof: 'warm' is not a value in °C/,
    ],
  ];

  it.each(cases)('%s', (_what, args, message) => {
    const run = biasproof(...args());
    expect(run.status).toBe(2);
    expect(run.stdout).toBe('');
    expect(run.stderr.endsWith('\n')).toBe(true);
    expect(run.stderr.trimEnd().split('\n')).toHaveLength(1);
    expect(run.stderr.trimEnd()).toMatch(message);
  });
});

describe('biasproof --help', () => {
  it('prints the usage, the JSON shapes and how an infinite value prints', () => {
    const run = biasproof('--help');
    expect(run.status).toBe(0);
    expect(run.stdout).toContain('biasproof op DECK');
    expect(run.stdout).toContain('biasproof ac DECK --probe NODE');
    expect(run.stdout).toContain('prints as null');
    expect(run.stdout).toContain('Exit status');
  });
});
