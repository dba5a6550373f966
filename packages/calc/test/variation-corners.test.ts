import { describe, expect, it } from 'vitest';
import { parseDeck } from '../src/deck-parse.ts';
import { EngineError } from '../src/errors.ts';
import { runCorners } from '../src/variation/corners.ts';
import { sensitivities } from '../src/variation/sensitivities.ts';

// Hand calculations: Vout = Vin·Rbottom/(Rtop + Rbottom) falls as the top grows and rises as the
// bottom grows, so its extremes sit at (top max, bottom min) and (top min, bottom max).

describe('corners of a divider against the hand calculation', () => {
  const circuit = parseDeck('divider\nV1 in 0 12\nR1 in out 8.2k\nR2 out 0 3.3k\n.end\n').circuit;
  const result = runCorners({
    circuit,
    parameters: [
      { target: 'r1', tolerancePercent: 5 },
      { target: 'r2', tolerancePercent: 5 },
      { target: 'v1', min: 11.4, max: 12.6 },
    ],
    probes: ['nodes.out', 'elements.r2.power'],
  });
  const out = result.probes['nodes.out']!;

  it('solves every one of the 2³ corners', () => {
    expect([result.method, result.evaluated, result.failed]).toEqual(['exhaustive', 8, 0]);
  });
  it('min = 11.4·3.135/(8.61 + 3.135) V at R1 high, R2 low, V1 low', () => {
    expect(out.min).toBeCloseTo((11.4 * 3135) / (8610 + 3135), 10);
    expect(out.minAt).toEqual({
      r1: expect.closeTo(8610, 8),
      r2: expect.closeTo(3135, 8),
      v1: 11.4,
    });
  });
  it('max = 12.6·3.465/(7.79 + 3.465) V at R1 low, R2 high, V1 high', () => {
    expect(out.max).toBeCloseTo((12.6 * 3465) / (7790 + 3465), 10);
    expect(out.maxAt).toEqual({
      r1: expect.closeTo(7790, 8),
      r2: expect.closeTo(3465, 8),
      v1: 12.6,
    });
  });
  it('the nominal sits between them: 12·3.3/11.5 V', () => {
    expect(out.nominal).toBeCloseTo((12 * 3.3) / 11.5, 10);
  });
  it('R2 power peaks where V(out)²/R2 does: V1 high, R1 low and R2 high', () => {
    const p = result.probes['elements.r2.power']!;
    const v = (12.6 * 3465) / (7790 + 3465);
    expect(p.max).toBeCloseTo((v * v) / 3465, 12);
  });
});

describe('more than 12 parameters: the sensitivity-directed search', () => {
  // 7 top and 7 bottom resistors in series, 1 kΩ each, ±2 %: the worst cases are every top
  // resistor at one end and every bottom one at the other (hand calculation as above).
  const lines = ['ladder', 'V1 n0 0 10'];
  for (let i = 1; i <= 14; i++) lines.push(`R${i} n${i - 1} ${i === 14 ? '0' : `n${i}`} 1k`);
  const circuit = parseDeck(`${lines.join('\n')}\n.end\n`).circuit;
  const parameters = Array.from({ length: 14 }, (_, i) => ({
    target: `r${i + 1}`,
    tolerancePercent: 2,
  }));
  const result = runCorners({ circuit, parameters, probes: ['nodes.n7'] });
  const p = result.probes['nodes.n7']!;

  it('chooses the search and solves far fewer than 2¹⁴ corners', () => {
    expect(result.method).toBe('sensitivity-search');
    expect(result.evaluated).toBeLessThan(100);
  });
  it('finds min = 10·7·0.98/(7·1.02 + 7·0.98) V with the top high and the bottom low', () => {
    expect(p.min).toBeCloseTo((10 * 6.86) / (7.14 + 6.86), 10);
    for (let i = 1; i <= 14; i++) expect(p.minAt[`r${i}`]).toBeCloseTo(i <= 7 ? 1020 : 980, 8);
  });
  it('finds max = 10·7·1.02/(7·0.98 + 7·1.02) V with the top low and the bottom high', () => {
    expect(p.max).toBeCloseTo((10 * 7.14) / (6.86 + 7.14), 10);
  });
  it('agrees with the exhaustive enumeration when that is forced', () => {
    const all = runCorners({ circuit, parameters, probes: ['nodes.n7'], exhaustiveLimit: 14 });
    expect(all.evaluated).toBe(2 ** 14);
    expect([all.probes['nodes.n7']!.min, all.probes['nodes.n7']!.max]).toEqual([
      expect.closeTo(p.min!, 12),
      expect.closeTo(p.max!, 12),
    ]);
  });
});

describe('normalized sensitivities against the hand derivation', () => {
  it('a divider: ∂ln Vout/∂ln R1 = −R1/(R1 + R2), ∂ln Vout/∂ln R2 = +R1/(R1 + R2), ∂ln Vout/∂ln V1 = 1', () => {
    const circuit = parseDeck('divider\nV1 in 0 12\nR1 in out 8.2k\nR2 out 0 3.3k\n.end\n').circuit;
    const s = sensitivities({
      circuit,
      parameters: [{ target: 'r1' }, { target: 'r2' }, { target: 'v1' }],
      probes: ['nodes.out'],
    });
    const k = 8.2 / 11.5;
    expect(s.byProbe['nodes.out']!.map((e) => [e.parameter, e.normalized])).toEqual([
      ['r1', expect.closeTo(-k, 7)],
      ['r2', expect.closeTo(k, 7)],
      ['v1', expect.closeTo(1, 7)],
    ]);
    // Absolute: ∂Vout/∂R2 = Vin·R1/(R1 + R2)² in V/Ω.
    expect(s.byProbe['nodes.out']![1]!.absolute).toBeCloseTo((12 * 8200) / 11500 ** 2, 11);
  });

  it('a BJT stage: IC rises with BF (sensitivity between 0 and 1, common practice for a stiff divider)', () => {
    const circuit = parseDeck(
      'ce\nVCC vcc 0 12\nR1 vcc b 56k\nR2 b 0 12k\nRC vcc c 3.9k\nRE e 0 1k\nQ1 c b e QN\n.model QN NPN (IS=2e-15 BF=180)\n.end\n',
    ).circuit;
    const s = sensitivities({
      circuit,
      parameters: [{ target: 'qn.bf' }],
      probes: ['devices.q1.ic'],
    });
    const bf = s.byProbe['devices.q1.ic']![0]!;
    expect(bf.parameter).toBe('qn.bf');
    expect(bf.normalized).toBeGreaterThan(0);
    expect(bf.normalized).toBeLessThan(1);
  });
});

describe('corners input errors', () => {
  it('when no probe is given, then bad-option asks for one', () => {
    const circuit = parseDeck('d\nV1 a 0 1\nR1 a 0 1k\n.end\n').circuit;
    expect(() =>
      runCorners({ circuit, parameters: [{ target: 'r1', tolerancePercent: 1 }], probes: [] }),
    ).toThrow(new EngineError('bad-option', 'corners: give at least one result path to probe'));
  });
});
