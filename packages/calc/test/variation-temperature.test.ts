import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { parseDeck } from '../src/deck-parse.ts';
import { EngineError } from '../src/errors.ts';
import {
  junctionTempco,
  runTemperatureSweep,
  temperaturesOf,
} from '../src/variation/temperature-sweep.ts';
import { ensureNgspice, ngspiceOperatingPoint } from './helpers/ngspice.ts';

// Reference: ngspice from Debian's package, the same deck with `.temp T` and the collector
// resistor's coefficient written as ngspice's TC1 (R(T) = R·(1 + TC1·(T − TNOM)), TNOM 27 °C).
// Tolerances as test/ngspice.test.ts: node voltages 1e-5 relative or 10 µV, currents 1e-4.

const deckFile = join(import.meta.dirname, 'decks', 't-ce-diode-bias.cir');
const text = readFileSync(deckFile, 'utf8');
const deck = parseDeck(text);
const temperatures = [-40, 27, 125];
const tc1 = 1.5e-3;
const nodes = ['b', 'c', 'd', 'e'];
const sweep = runTemperatureSweep({
  circuit: deck.circuit,
  temperatures,
  parameters: [{ target: 'rc', tempcoPpm: tc1 * 1e6 }],
  probes: [...nodes.map((n) => `nodes.${n}`), 'devices.q1.ic', 'devices.q1.ib', 'devices.d1.id'],
});

function within(engine: number | undefined, reference: number, rel: number, abs: number): boolean {
  return (
    engine !== undefined && Math.abs(engine - reference) <= Math.max(rel * Math.abs(reference), abs)
  );
}

beforeAll(() => {
  ensureNgspice();
}, 600_000);

describe('temperature sweep against ngspice .temp decks (Debian package)', () => {
  it.each(temperatures)(
    '%s °C: node voltages within 1e-5 relative or 10 µV, currents within 1e-4',
    (t) => {
      const ngspiceDeck = text
        .replace(/^RC vcc c 4\.7k$/m, `RC vcc c 4.7k tc1=${tc1}`)
        .replace(/^\.op$/m, `.temp ${t}\n.op`);
      expect(ngspiceDeck).toContain('tc1=');
      const ref = ngspiceOperatingPoint(ngspiceDeck, deck.circuit);
      const point = sweep.points.find((p) => p.temperature === t)!;
      expect(point.ok).toBe(true);
      const off: string[] = [];
      for (const n of nodes) {
        if (!within(point.values![`nodes.${n}`], ref.nodes[n]!, 1e-5, 10e-6))
          off.push(`V(${n}): ${point.values![`nodes.${n}`]} vs ${ref.nodes[n]}`);
      }
      const currents: [string, number][] = [
        ['devices.q1.ic', ref.devices.q1!.ic!],
        ['devices.q1.ib', ref.devices.q1!.ib!],
        ['devices.d1.id', ref.devices.d1!.id!],
      ];
      for (const [path, value] of currents)
        if (!within(point.values![path], value, 1e-4, 1e-15))
          off.push(`${path}: ${point.values![path]} vs ${value}`);
      expect(off).toEqual([]);
    },
  );

  it('the collector moves by the hand-expected amount of the coefficient: RC(125 °C) = 4.7 kΩ·(1 + 1.5e-3·98)', () => {
    // V(c) = VCC − IC·RC(T), so (VCC − V(c))/IC recovers RC(T) (IC is what the device carries).
    const hot = sweep.points.find((p) => p.temperature === 125)!.values!;
    expect((12 - hot['nodes.c']!) / hot['devices.q1.ic']!).toBeCloseTo(4700 * (1 + tc1 * 98), 6);
  });
});

describe('diode forward-voltage temperature coefficient at 1 mA', () => {
  // 1 mA forced into an exponential diode (IS = 1e-14 A, N = 1, RS = 0, XTI = 3, EG = 1.11 eV).
  const diode = parseDeck(
    'tempco\nI1 0 a 1m\nD1 a 0 DS\n.model DS D (IS=1e-14 N=1 XTI=3 EG=1.11)\n.end\n',
  ).circuit;
  const at = (t: number) =>
    runTemperatureSweep({ circuit: diode, temperatures: [t], probes: ['nodes.a'] }).points[0]!
      .values!['nodes.a']!;
  const h = 0.05;
  const numeric = (at(27 + h) - at(27 - h)) / (2 * h);
  const vd = at(27);

  it('is about −2 mV/K (common practice for silicon near 1 mA): between −2.5 and −1.5 mV/K', () => {
    expect(numeric).toBeGreaterThan(-2.5e-3);
    expect(numeric).toBeLessThan(-1.5e-3);
  });

  it('equals (VD − EG − XTI·VT)/T from SPICE’s IS(T) law within 1e-5 relative', () => {
    // Derivation: VD = N·VT·ln(I/IS(T)) with IS(T) = IS·(T/Tn)^(XTI/N)·exp((T/Tn − 1)·EG/(N·VT)),
    // at constant I: dVD/dT = (VD − EG − XTI·VT)/T (N cancels). VT = kT/q at 300.15 K.
    const vt = (1.380649e-23 * 300.15) / 1.602176634e-19;
    const exact = (vd - 1.11 - 3 * vt) / 300.15;
    expect(junctionTempco(vd, 1.11, 3, 27)).toBeCloseTo(exact, 15);
    expect(Math.abs(numeric / exact - 1)).toBeLessThan(1e-5);
  });
});

describe('temperature lists', () => {
  it('a range includes both ends', () => {
    expect(temperaturesOf({ from: -40, to: 125, step: 55 })).toEqual([-40, 15, 70, 125]);
    expect(temperaturesOf({ from: 0, to: 100, step: 30 })).toEqual([0, 30, 60, 90, 100]);
  });
  it('when a temperature is below absolute zero, then bad-option says so', () => {
    expect(() => temperaturesOf([25, -300])).toThrow(
      new EngineError('bad-option', 'temperatures 1: a temperature must be above absolute zero'),
    );
  });
});
