import { describe, expect, it } from 'vitest';
import { parseDeck } from '../src/deck-parse.ts';
import { solveOperatingPoint } from '../src/dc.ts';
import { standardValueSuggestions } from '../src/variation/standard-suggestions.ts';
import { E_SERIES, nearestStandardValue, seriesDecade } from '../src/variation/standard-values.ts';

// Reference: IEC 60063:2015, "Preferred number series for resistors and capacitors", tables of
// the E12, E24, E48 and E96 series, copied here value by value (not computed), so that a typo
// in the engine's table cannot hide behind the same typo in a formula.

const IEC_E24 = [
  1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6,
  6.2, 6.8, 7.5, 8.2, 9.1,
];
const IEC_E12 = [1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2];
const IEC_E96 = [
  1.0, 1.02, 1.05, 1.07, 1.1, 1.13, 1.15, 1.18, 1.21, 1.24, 1.27, 1.3, 1.33, 1.37, 1.4, 1.43, 1.47,
  1.5, 1.54, 1.58, 1.62, 1.65, 1.69, 1.74, 1.78, 1.82, 1.87, 1.91, 1.96, 2.0, 2.05, 2.1, 2.15, 2.21,
  2.26, 2.32, 2.37, 2.43, 2.49, 2.55, 2.61, 2.67, 2.74, 2.8, 2.87, 2.94, 3.01, 3.09, 3.16, 3.24,
  3.32, 3.4, 3.48, 3.57, 3.65, 3.74, 3.83, 3.92, 4.02, 4.12, 4.22, 4.32, 4.42, 4.53, 4.64, 4.75,
  4.87, 4.99, 5.11, 5.23, 5.36, 5.49, 5.62, 5.76, 5.9, 6.04, 6.19, 6.34, 6.49, 6.65, 6.81, 6.98,
  7.15, 7.32, 7.5, 7.68, 7.87, 8.06, 8.25, 8.45, 8.66, 8.87, 9.09, 9.31, 9.53, 9.76,
];

/** 10^(i/n) rounded to `digits` significant digits: the rule the newer series follow. */
const formula = (n: number, digits: number): number[] =>
  Array.from({ length: n }, (_, i) => Number((10 ** (i / n)).toPrecision(digits)));

describe('IEC 60063 tables', () => {
  it('E24 holds the 24 values of the standard, in order', () => {
    expect(seriesDecade('E24')).toEqual(IEC_E24);
  });

  it('E24 departs from 10^(i/24) rounded to two digits at exactly the eight historical values', () => {
    // IEC 60063 keeps E24's values from before the rule; the rounded powers would be
    // 2.6 2.9 3.2 3.5 3.8 4.2 4.6 8.3 in their places.
    const rounded = formula(24, 2);
    const differing = IEC_E24.filter((v, i) => v !== rounded[i]);
    expect(differing).toEqual([2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 8.2]);
    expect(IEC_E24.flatMap((v, i) => (v !== rounded[i] ? [rounded[i]] : []))).toEqual([
      2.6, 2.9, 3.2, 3.5, 3.8, 4.2, 4.6, 8.3,
    ]);
  });

  it('E12 is every other E24 value', () => {
    expect(seriesDecade('E12')).toEqual(IEC_E12);
    expect(IEC_E24.filter((_, i) => i % 2 === 0)).toEqual(IEC_E12);
  });

  it('E96 holds the 96 values of the standard, each 10^(i/96) rounded to three digits', () => {
    expect(seriesDecade('E96')).toEqual(IEC_E96);
    expect(IEC_E96).toEqual(formula(96, 3));
  });

  it('E48 is every other E96 value, each 10^(i/48) rounded to three digits', () => {
    expect(seriesDecade('E48')).toEqual(IEC_E96.filter((_, i) => i % 2 === 0));
    expect(seriesDecade('E48')).toEqual(formula(48, 3));
  });

  it('every table has as many values as its name says', () => {
    expect(Object.fromEntries(Object.entries(E_SERIES).map(([k, v]) => [k, v.length]))).toEqual({
      E12: 12,
      E24: 24,
      E48: 48,
      E96: 96,
    });
  });
});

describe('nearest preferred value (by ratio, across decades)', () => {
  // Hand-picked: each expected value is the table entry with the smallest |ln(candidate/value)|.
  const cases: [value: number, series: keyof typeof E_SERIES, expected: number][] = [
    [4650, 'E24', 4700],
    [4460, 'E24', 4300],
    [4500, 'E24', 4700], // ln(4700/4500) = 0.0435 < ln(4500/4300) = 0.0455
    [9.6, 'E24', 10], // closer to the next decade's 10 than to 9.1
    [9.6, 'E12', 10],
    [0.0333, 'E12', 0.033],
    [1e6, 'E96', 1e6],
    [1000, 'E12', 1000], // an exact power of ten stays
    [10_200, 'E96', 10_200],
    [10_350, 'E96', 10_500], // ln(10500/10350) = 0.01439 < ln(10350/10200) = 0.01460
    [2.2e-6, 'E48', 2.15e-6], // ln(2.2/2.15) = 0.0230 < ln(2.26/2.2) = 0.0269
    [12_345, 'E48', 12_100],
  ];
  it.each(cases)(
    '%s in %s → %s (the double nearest the decimal value)',
    (value, series, expected) => {
      const r = nearestStandardValue(value, series);
      expect(r.value).toBe(expected);
      expect(r.errorPercent).toBeCloseTo(((expected - value) / value) * 100, 9);
    },
  );

  it('when the value is not positive, then bad-value says a standard value needs one', () => {
    expect(() => nearestStandardValue(0, 'E24')).toThrow(
      'a standard value needs a finite value > 0, not 0',
    );
  });
});

describe('standard-value suggestions recompute the bias point', () => {
  it('when every resistor moves to its E12 value, then the divider output is the hand-calculated one', () => {
    // Hand calculation: 12 V · R2/(R1 + R2) with R1 = 8.06 k → 8.2 k (E12), R2 = 3.32 k → 3.3 k.
    const { circuit } = parseDeck('divider\nV1 in 0 12\nR1 in out 8.06k\nR2 out 0 3.32k\n.end\n');
    const r = standardValueSuggestions({ circuit, probes: ['nodes.out'], series: ['E12', 'E96'] });
    expect(r.resistors.map((x) => [x.element, x.suggestions.E12?.value])).toEqual([
      ['r1', 8200],
      ['r2', 3300],
    ]);
    const e12 = r.recomputed.E12;
    expect(e12?.ok).toBe(true);
    if (!e12?.ok) return;
    expect(e12.values['nodes.out']).toBeCloseTo((12 * 3300) / (8200 + 3300), 9);
    const nominal = (12 * 3320) / (8060 + 3320);
    expect(r.nominal['nodes.out']).toBeCloseTo(nominal, 9);
    expect(e12.changePercent['nodes.out']).toBeCloseTo(
      ((e12.values['nodes.out']! - nominal) / nominal) * 100,
      6,
    );
    // E96 holds both values, so nothing moves.
    const e96 = r.recomputed.E96;
    expect(e96?.ok && e96.values['nodes.out']).toBeCloseTo(
      solveOperatingPoint(circuit).nodes.out!,
      12,
    );
  });
});
