import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { AcSweep, Circuit } from '../../src/index.ts';
import { isGround } from '../../src/index.ts';

/**
 * Runs decks through ngspice, the reference simulator of the engine's tests (Debian package
 * `ngspice`). Tolerance options are added to a temporary copy of the deck together with a
 * `.control` block that prints exactly what the tests compare; the deck's own analysis cards
 * are dropped so that ngspice runs nothing else.
 */

export const ngspicePath = '/usr/bin/ngspice';

/** Tight tolerances so that ngspice's own convergence error sits far below the comparison's. */
export const referenceOptions = '.options reltol=1e-7 abstol=1e-16 vntol=1e-10';

/**
 * Makes sure ngspice is installed. As root (CI, developer machines) it installs Debian's
 * package when missing; otherwise it throws, because the comparison must not be skipped.
 */
export function ensureNgspice(): string {
  if (existsSync(ngspicePath)) return ngspicePath;
  if (process.getuid?.() !== 0) {
    throw new Error(
      `ngspice is not installed at ${ngspicePath} and this user cannot install it: run 'apt-get install -y ngspice' as root`,
    );
  }
  const install = (): void => {
    // Waits for the dpkg lock when another test run installs a package at the same time.
    execFileSync(
      'apt-get',
      ['-o', 'DPkg::Lock::Timeout=300', 'install', '-y', '--no-install-recommends', 'ngspice'],
      {
        stdio: 'ignore',
        timeout: 300_000,
        env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
      },
    );
  };
  try {
    install();
  } catch {
    // A fresh machine may have no package lists yet.
    execFileSync('apt-get', ['-o', 'DPkg::Lock::Timeout=300', 'update'], {
      stdio: 'ignore',
      timeout: 300_000,
    });
    install();
  }
  if (!existsSync(ngspicePath))
    throw new Error(`apt-get installed ngspice but ${ngspicePath} is missing`);
  return ngspicePath;
}

/** The deck without its analysis and `.end` cards; continuation lines of dropped cards go too. */
function circuitPart(deck: string): string {
  const out: string[] = [];
  let dropping = false;
  for (const line of deck.split(/\r?\n/)) {
    const trimmed = line.trim();
    if (trimmed.startsWith('+')) {
      if (!dropping) out.push(line);
      continue;
    }
    dropping = /^\.(op|ac|end|control|endc)\b/i.test(trimmed) && out.length > 0;
    if (!dropping) out.push(line);
  }
  return out.join('\n');
}

/** Runs ngspice in batch mode on `deck` plus `control` lines; returns stdout and the work folder's files. */
export function runNgspice(
  deck: string,
  control: string[],
  outputFile?: string,
): { stdout: string; output?: string } {
  ensureNgspice();
  const dir = mkdtempSync(join(tmpdir(), 'biasproof-ngspice-'));
  try {
    const file = join(dir, 'deck.cir');
    writeFileSync(
      file,
      [
        circuitPart(deck),
        referenceOptions,
        '.control',
        ...control,
        'quit 0',
        '.endc',
        '.end',
        '',
      ].join('\n'),
    );
    const run = spawnSync(ngspicePath, ['-b', file], {
      cwd: dir,
      encoding: 'utf8',
      timeout: 60_000,
    });
    // `quit 0` ends a good run with status 0; ngspice exits 1 when the deck has an error.
    if (run.status !== 0 || /error/i.test(run.stderr))
      throw new Error(`ngspice failed (${String(run.status)}): ${run.stderr}${run.stdout}`);
    const output = outputFile ? readFileSync(join(dir, outputFile), 'utf8') : undefined;
    return { stdout: run.stdout, ...(output === undefined ? {} : { output }) };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** ngspice's quantities for one device, by ngspice's own names (`id`, `gd`, `ic`, `gpi`, `gds`…); currents flow into the terminal. */
export type NgspiceDevice = Record<string, number>;

export interface NgspiceOperatingPoint {
  /** Node voltages in V, by lowercase node name. */
  nodes: Record<string, number>;
  /** Voltage-source branch currents in A (positive into the + terminal), by lowercase name. */
  sources: Record<string, number>;
  devices: Record<string, NgspiceDevice>;
}

/** Device quantities read from ngspice for each element letter. */
export const ngspiceDeviceQuantities: Record<string, readonly string[]> = {
  D: ['id', 'gd'],
  Q: ['ic', 'ib', 'gm', 'gpi', 'go'],
  M: ['id', 'gm', 'gmbs', 'gds'],
};

/** Solves the deck's operating point in ngspice and reads every node, source and device quantity. */
export function ngspiceOperatingPoint(deck: string, circuit: Circuit): NgspiceOperatingPoint {
  const nodes = [
    ...new Set(circuit.elements.flatMap((e) => e.nodes.map((n) => n.toLowerCase()))),
  ].filter((n) => !isGround(n));
  const sources = circuit.elements.filter((e) => e.kind === 'V').map((e) => e.name.toLowerCase());
  const devices = circuit.elements.flatMap((e) =>
    (ngspiceDeviceQuantities[e.kind] ?? []).map((q) => ({ name: e.name.toLowerCase(), q })),
  );
  const prints = [
    ...nodes.map((n) => `print v(${n})`),
    ...sources.map((s) => `print i(${s})`),
    ...devices.map(({ name, q }) => `print @${name}[${q}]`),
  ];
  const { stdout } = runNgspice(deck, ['set numdgt=15', 'op', ...prints]);
  const printed = new Map<string, number>();
  for (const match of stdout.matchAll(/^(\S+) = ([-+0-9.eE]+)\s*$/gm))
    printed.set((match[1] ?? '').toLowerCase(), Number(match[2]));
  const read = (expr: string): number => {
    const value = printed.get(expr);
    if (value === undefined || Number.isNaN(value))
      throw new Error(`ngspice printed no value for ${expr}:\n${stdout}`);
    return value;
  };
  const result: NgspiceOperatingPoint = { nodes: {}, sources: {}, devices: {} };
  for (const n of nodes) result.nodes[n] = read(`v(${n})`);
  for (const s of sources) result.sources[s] = read(`i(${s})`);
  for (const { name, q } of devices) (result.devices[name] ??= {})[q] = read(`@${name}[${q}]`);
  // ngspice's MOSFET reports its drain current with the device's polarity folded in (positive
  // when a PMOS conducts source to drain); BJT currents it reports as they flow. Turn the PMOS
  // figure into the current flowing into the drain, the convention of the engine and SPICE's KCL.
  const pmosModels = new Set(
    circuit.models.filter((m) => m.kind === 'PMOS').map((m) => m.name.toLowerCase()),
  );
  for (const e of circuit.elements) {
    const device = result.devices[e.name.toLowerCase()];
    if (e.kind === 'M' && pmosModels.has(e.model.toLowerCase()) && device?.id !== undefined)
      device.id = -device.id;
  }
  return result;
}

export interface NgspiceAcResponse {
  /** Hz */
  freq: number[];
  /** 20·log10|V(probe)| in dB */
  db: number[];
  /** Phase of V(probe) in degrees, continuous (not wrapped). */
  deg: number[];
}

/** Runs the sweep in ngspice and reads magnitude and phase of V(probe) at every point. */
export function ngspiceAc(deck: string, sweep: AcSweep, probe: string): NgspiceAcResponse {
  const { output = '' } = runNgspice(
    deck,
    [
      `ac ${sweep.type} ${sweep.points} ${sweep.fstart} ${sweep.fstop}`,
      `let bp_db = vdb(${probe})`,
      `let bp_deg = 180/pi*cph(v(${probe}))`,
      'set wr_singlescale',
      'wrdata ac.txt bp_db bp_deg',
    ],
    'ac.txt',
  );
  const rows = output
    .trim()
    .split('\n')
    .map((line) => line.trim().split(/\s+/).map(Number));
  return {
    freq: rows.map((r) => r[0] ?? Number.NaN),
    db: rows.map((r) => r[1] ?? Number.NaN),
    deg: rows.map((r) => r[2] ?? Number.NaN),
  };
}
