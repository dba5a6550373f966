import { z } from 'zod';
import { EngineError } from '../errors.ts';

/**
 * Preferred numbers of IEC 60063:2015 ("Preferred number series for resistors and capacitors"),
 * one decade each, as integers of 2 (E12, E24) or 3 (E48, E96) significant digits.
 *
 * E48 and E96 are 10^(i/n) rounded to three digits, every one of them. E12 and E24 are older
 * than the rule: eight E24 values differ from 10^(i/24) rounded to two digits — 2.7, 3.0, 3.3,
 * 3.6, 3.9, 4.3 and 4.7 sit one step above the rounded power and 8.2 one step below (the formula
 * gives 2.6, 2.9, 3.2, 3.5, 3.8, 4.2, 4.6 and 8.3) — and E12, every other E24 value, shares
 * five of them (2.7, 3.3, 3.9, 4.7, 8.2). The tables are therefore written out, not computed.
 */

export const E_SERIES = {
  E12: [10, 12, 15, 18, 22, 27, 33, 39, 47, 56, 68, 82],
  E24: [
    10, 11, 12, 13, 15, 16, 18, 20, 22, 24, 27, 30, 33, 36, 39, 43, 47, 51, 56, 62, 68, 75, 82, 91,
  ],
  E48: [
    100, 105, 110, 115, 121, 127, 133, 140, 147, 154, 162, 169, 178, 187, 196, 205, 215, 226, 237,
    249, 261, 274, 287, 301, 316, 332, 348, 365, 383, 402, 422, 442, 464, 487, 511, 536, 562, 590,
    619, 649, 681, 715, 750, 787, 825, 866, 909, 953,
  ],
  E96: [
    100, 102, 105, 107, 110, 113, 115, 118, 121, 124, 127, 130, 133, 137, 140, 143, 147, 150, 154,
    158, 162, 165, 169, 174, 178, 182, 187, 191, 196, 200, 205, 210, 215, 221, 226, 232, 237, 243,
    249, 255, 261, 267, 274, 280, 287, 294, 301, 309, 316, 324, 332, 340, 348, 357, 365, 374, 383,
    392, 402, 412, 422, 432, 442, 453, 464, 475, 487, 499, 511, 523, 536, 549, 562, 576, 590, 604,
    619, 634, 649, 665, 681, 698, 715, 732, 750, 768, 787, 806, 825, 845, 866, 887, 909, 931, 953,
    976,
  ],
} as const satisfies Record<string, readonly number[]>;

export type ESeries = keyof typeof E_SERIES;
export const E_SERIES_NAMES = Object.keys(E_SERIES) as ESeries[];
export const eSeriesSchema = z.enum(['E12', 'E24', 'E48', 'E96']);

/** The series' values in one decade as numbers in [1, 10): 4.7, 4.75… */
export function seriesDecade(series: ESeries): number[] {
  const table = E_SERIES[series];
  const scale = table[0] === 10 ? 10 : 100;
  return table.map((m) => m / scale);
}

/** mantissa·10^exponent, rounded once (a division for negative exponents, so 4.7e-6 is the double nearest 4.7 µ). */
function scaled(mantissa: number, exponent: number): number {
  return exponent >= 0 ? mantissa * 10 ** exponent : mantissa / 10 ** -exponent;
}

export interface StandardValue {
  series: ESeries;
  /** The preferred value nearest the input (by ratio). */
  value: number;
  /** (value − input)/input, %. */
  errorPercent: number;
}

/** The preferred value of `series` nearest `value` (> 0) by ratio, across decades. */
export function nearestStandardValue(value: number, series: ESeries): StandardValue {
  if (!(value > 0) || !Number.isFinite(value))
    throw new EngineError('bad-value', `a standard value needs a finite value > 0, not ${value}`);
  const table = E_SERIES[series];
  const digits = table[0] === 10 ? 2 : 3;
  let decade = Math.floor(Math.log10(value));
  // log10 may land a hair below an exact power of ten.
  while (scaled(1, decade) > value) decade--;
  while (scaled(1, decade + 1) <= value) decade++;
  const exponent = decade - digits + 1;
  let best = scaled(table[0] * 10, exponent);
  let bestDistance = Math.abs(Math.log(best / value));
  for (const m of table) {
    const candidate = scaled(m, exponent);
    const distance = Math.abs(Math.log(candidate / value));
    if (distance < bestDistance) {
      best = candidate;
      bestDistance = distance;
    }
  }
  return { series, value: best, errorPercent: ((best - value) / value) * 100 };
}
