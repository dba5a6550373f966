import { describe, expect, it } from 'vitest';
import { compareDiodeLaws } from '../src/compare.ts';

describe('diode-law comparison against the exponential law', () => {
  const result = compareDiodeLaws({
    elements: [
      { kind: 'V', name: 'V1', nodes: ['in', '0'], dc: 5 },
      { kind: 'R', name: 'R1', nodes: ['in', 'a'], value: 1e3 },
      { kind: 'D', name: 'D1', nodes: ['a', '0'], model: 'dm' },
    ],
    models: [{ name: 'dm', kind: 'D', params: {} }],
  });
  it('lists every law, exponential first with zero difference', () => {
    expect(result.laws.map((l) => l.law)).toEqual([
      'exponential',
      'piecewise-linear',
      'constant-drop',
      'ideal',
    ]);
    expect(result.laws[0]!.currentDifferencePercent.d1).toBe(0);
  });
  it('gives each law’s % difference from its own operating point (hand check of the constant-drop row)', () => {
    const exp = result.reference;
    const cd = result.laws.find((l) => l.law === 'constant-drop')!;
    const idExp = exp.devices.d1!.kind === 'D' ? exp.devices.d1!.id : NaN;
    expect(cd.currentDifferencePercent.d1).toBeCloseTo(((4.3e-3 - idExp) / idExp) * 100, 9);
    expect(cd.nodeDifferencePercent.a).toBeCloseTo(((0.7 - exp.nodes.a!) / exp.nodes.a!) * 100, 9);
    // The ideal diode puts node a at 0 V: −100 %.
    expect(result.laws.find((l) => l.law === 'ideal')!.nodeDifferencePercent.a).toBeCloseTo(
      -100,
      9,
    );
    // A source node is the same under every law.
    expect(cd.nodeDifferencePercent.in).toBe(0);
  });
  it('reports a law that cannot be solved instead of failing the whole comparison', () => {
    const r = compareDiodeLaws({
      elements: [
        { kind: 'V', name: 'V1', nodes: ['a', '0'], dc: 1 },
        { kind: 'D', name: 'D1', nodes: ['a', '0'], model: 'dm' },
      ],
      models: [{ name: 'dm', kind: 'D', params: { RS: 10 } }],
    });
    const cd = r.laws.find((l) => l.law === 'constant-drop')!;
    expect(cd.operatingPoint).toBeNull();
    expect(cd.error?.code).toBe('voltage-source-loop');
  });
});
