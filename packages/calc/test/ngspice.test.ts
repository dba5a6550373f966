import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { runAcSweep } from '../src/ac.ts';
import { solveOperatingPoint } from '../src/dc.ts';
import type { ParsedDeck } from '../src/index.ts';
import { exportDeck, parseDeck } from '../src/index.ts';
import type { NgspiceOperatingPoint } from './helpers/ngspice.ts';
import { ensureNgspice, ngspiceAc, ngspiceOperatingPoint } from './helpers/ngspice.ts';

// Reference: ngspice from Debian's package `ngspice`, run on the same decks with
// `.options reltol=1e-7 abstol=1e-16 vntol=1e-10`. ngspice computes the thermal voltage from
// the CODATA 2014 values of k and q, the engine from the exact SI 2019 values; they differ by
// 3.4e-7 relative, well inside the tolerances below. ngspice, like the engine, places
// GMIN = 1e-12 S across every junction, so reverse currents compare like for like.

const deckDir = join(import.meta.dirname, 'decks');

/** Every deck of the suite; the AC decks name the node whose response is compared. */
const decks: { file: string; probe?: string }[] = [
  { file: 'd-series.cir' },
  { file: 'd-parallel.cir' },
  { file: 'd-bridge.cir' },
  { file: 'd-temp75.cir' },
  { file: 'q-npn-ce.cir' },
  { file: 'q-pnp-stage.cir' },
  { file: 'q-mirror.cir' },
  { file: 'q-diffpair.cir' },
  { file: 'q-saturated.cir' },
  { file: 'm-cs.cir' },
  { file: 'm-inverter-triode.cir' },
  { file: 'm-diffpair-mirror.cir' },
  { file: 'ctrl-sources.cir' },
  { file: 'ac-rc-lowpass.cir', probe: 'out' },
  { file: 'ac-ce-amp.cir', probe: 'out' },
  { file: 'ac-mos-cs.cir', probe: 'd' },
];
const acDecks = decks.filter((d): d is { file: string; probe: string } => d.probe !== undefined);

/** Node voltages: 1e-5 relative or 10 µV, whichever is larger. */
const voltage = { rel: 1e-5, abs: 10e-6 };
/** Currents (A) and conductances (S): 1e-4 relative; the floor is ngspice's own abstol scale. */
const current = { rel: 1e-4, abs: 1e-15 };

interface Loaded {
  text: string;
  deck: ParsedDeck;
}
const loaded = new Map<string, Loaded>();
const references = new Map<string, NgspiceOperatingPoint>();

function load(file: string): Loaded {
  let entry = loaded.get(file);
  if (!entry) {
    const text = readFileSync(join(deckDir, file), 'utf8');
    entry = { text, deck: parseDeck(text) };
    loaded.set(file, entry);
  }
  return entry;
}

function reference(file: string): NgspiceOperatingPoint {
  let ref = references.get(file);
  if (!ref) {
    const { text, deck } = load(file);
    ref = ngspiceOperatingPoint(text, deck.circuit);
    references.set(file, ref);
  }
  return ref;
}

function engineOp(file: string) {
  const { deck } = load(file);
  const temperature = deck.directives.temperature;
  return solveOperatingPoint(deck.circuit, temperature === undefined ? {} : { temperature });
}

/** Lists every quantity outside tolerance, so that a failure shows all of them with both values. */
function compare(
  label: string,
  engine: number | undefined,
  ngspice: number,
  tol: { rel: number; abs: number },
  out: string[],
): void {
  const limit = Math.max(tol.rel * Math.abs(ngspice), tol.abs);
  if (engine === undefined || !(Math.abs(engine - ngspice) <= limit)) {
    out.push(
      `${label}: engine ${String(engine)} vs ngspice ${ngspice} (limit ${limit.toExponential(2)})`,
    );
  }
}

const inverse = (r: number | undefined): number | undefined =>
  r === undefined ? undefined : 1 / r;

beforeAll(() => {
  ensureNgspice();
}, 600_000);

describe('bias point against ngspice (Debian package; CODATA 2014 constants)', () => {
  it.each(decks)('$file: node voltages within 1e-5 relative or 10 µV', ({ file }) => {
    const ref = reference(file);
    const op = engineOp(file);
    const off: string[] = [];
    for (const [node, v] of Object.entries(ref.nodes))
      compare(`V(${node})`, op.nodes[node], v, voltage, off);
    expect(off).toEqual([]);
  });

  it.each(decks)(
    '$file: source and device currents and small-signal conductances within 1e-4 relative',
    ({ file }) => {
      const ref = reference(file);
      const op = engineOp(file);
      const off: string[] = [];
      for (const [name, i] of Object.entries(ref.sources))
        compare(`I(${name})`, op.sources[name], i, current, off);
      for (const [name, q] of Object.entries(ref.devices)) {
        const d = op.devices[name];
        if (d?.kind === 'D') {
          compare(`${name}.id`, d.id, q.id ?? Number.NaN, current, off);
          compare(`${name}.1/rd (gd)`, inverse(d.rd), q.gd ?? Number.NaN, current, off);
        } else if (d?.kind === 'Q') {
          compare(`${name}.ic`, d.ic, q.ic ?? Number.NaN, current, off);
          compare(`${name}.ib`, d.ib, q.ib ?? Number.NaN, current, off);
          compare(`${name}.gm`, d.gm, q.gm ?? Number.NaN, current, off);
          compare(`${name}.1/rpi (gpi)`, inverse(d.rpi), q.gpi ?? Number.NaN, current, off);
          compare(`${name}.1/ro (go)`, inverse(d.ro), q.go ?? Number.NaN, current, off);
        } else if (d?.kind === 'M') {
          compare(`${name}.id`, d.id, q.id ?? Number.NaN, current, off);
          compare(`${name}.gm`, d.gm, q.gm ?? Number.NaN, current, off);
          compare(`${name}.gmb (gmbs)`, d.gmb, q.gmbs ?? Number.NaN, current, off);
          compare(`${name}.1/ro (gds)`, inverse(d.ro), q.gds ?? Number.NaN, current, off);
        } else {
          off.push(`${name}: the engine reports no device of this name`);
        }
      }
      expect(off).toEqual([]);
    },
  );
});

/** Phase difference folded into (−180°, 180°], since one side may unwrap and the other not. */
const phaseGap = (a: number, b: number): number => {
  const d = ((((a - b) % 360) + 540) % 360) - 180;
  return Math.abs(d);
};

describe('AC response against ngspice (Debian package; CODATA 2014 constants)', () => {
  it.each(acDecks)(
    '$file: |V($probe)| within 0.01 dB and phase within 0.1° at every sweep point',
    ({ file, probe }) => {
      const { text, deck } = load(file);
      const sweep = deck.directives.ac;
      if (!sweep) throw new Error(`${file} has no .ac card`);
      const ref = ngspiceAc(text, sweep, probe);
      const temperature = deck.directives.temperature;
      const result = runAcSweep(deck.circuit, {
        sweep,
        probe,
        ...(temperature === undefined ? {} : { temperature }),
      });
      expect(result.freq.length).toBe(ref.freq.length);
      const off: string[] = [];
      ref.freq.forEach((f, i) => {
        const at = `${f.toPrecision(6)} Hz`;
        compare(`f[${i}]`, result.freq[i], f, { rel: 1e-7, abs: 0 }, off);
        compare(`dB at ${at}`, result.db[i], ref.db[i] ?? Number.NaN, { rel: 0, abs: 0.01 }, off);
        const gap = phaseGap(result.deg[i] ?? Number.NaN, ref.deg[i] ?? Number.NaN);
        if (!(gap <= 0.1))
          off.push(
            `phase at ${at}: engine ${String(result.deg[i])}° vs ngspice ${String(ref.deg[i])}°`,
          );
      });
      expect(off).toEqual([]);
    },
  );
});

describe('exported decks run in ngspice (Debian package)', () => {
  it.each(decks)(
    '$file: exportDeck(parseDeck(deck)) gives ngspice the same bias point as the deck itself',
    ({ file }) => {
      const { deck } = load(file);
      const exported = exportDeck(deck.circuit, deck.directives);
      const again = ngspiceOperatingPoint(exported, parseDeck(exported).circuit);
      const ref = reference(file);
      const off: string[] = [];
      for (const [node, v] of Object.entries(ref.nodes))
        compare(`V(${node})`, again.nodes[node], v, { rel: 1e-9, abs: 1e-12 }, off);
      expect(off).toEqual([]);
    },
  );
});
