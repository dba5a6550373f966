import { z } from 'zod';
import { parseInput } from './spec.ts';

/**
 * Summary statistics and histogram bins of sampled results. Percentiles interpolate linearly
 * between order statistics (R. J. Hyndman, Y. Fan, "Sample quantiles in statistical packages",
 * The American Statistician 50(4), 1996 — their definition 7, the default of R and NumPy).
 * 0.135 % and 99.865 % are the ±3σ points of a normal distribution.
 */

export interface SampleStatistics {
  /** Values the statistics are taken over (converged samples). */
  count: number;
  mean: number;
  /** Sample standard deviation (n − 1 in the denominator); 0 for a single value. */
  sigma: number;
  min: number;
  max: number;
  /** 0.135th percentile (−3σ of a normal). */
  p00135: number;
  /** Median. */
  p50: number;
  /** 99.865th percentile (+3σ of a normal). */
  p99865: number;
}

/** The p-quantile (0…1) of ascending `sorted` values (Hyndman–Fan definition 7). */
export function quantileSorted(sorted: ArrayLike<number>, p: number): number {
  const n = sorted.length;
  if (n === 0) return NaN;
  const h = (n - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, n - 1);
  const a = sorted[lo]!;
  return a + (h - lo) * (sorted[hi]! - a);
}

/** Statistics of finite values; NaN entries (failed samples) are left out and not counted. */
export function sampleStatistics(values: ArrayLike<number>): SampleStatistics {
  const finite: number[] = [];
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    if (Number.isFinite(v)) finite.push(v);
  }
  const sorted = Float64Array.from(finite).sort();
  const n = sorted.length;
  let sum = 0;
  for (let i = 0; i < n; i++) sum += sorted[i]!;
  const mean = n > 0 ? sum / n : NaN;
  // Two passes: the sum of squared deviations does not cancel the way Σx² − n·mean² does.
  let squares = 0;
  for (let i = 0; i < n; i++) squares += (sorted[i]! - mean) ** 2;
  return {
    count: n,
    mean,
    sigma: n > 1 ? Math.sqrt(squares / (n - 1)) : n === 1 ? 0 : NaN,
    min: n > 0 ? sorted[0]! : NaN,
    max: n > 0 ? sorted[n - 1]! : NaN,
    p00135: quantileSorted(sorted, 0.00135),
    p50: quantileSorted(sorted, 0.5),
    p99865: quantileSorted(sorted, 0.99865),
  };
}

export const histogramOptionsSchema = z
  .object({
    /** Number of bins. Default √n, between 5 and 50. */
    bins: z.number().int().min(1).max(1000).optional(),
    /** Left edge of the first bin. Default the smallest value. */
    min: z.number().finite().optional(),
    /** Right edge of the last bin. Default the largest value. */
    max: z.number().finite().optional(),
  })
  .refine((o) => o.min === undefined || o.max === undefined || o.min <= o.max, {
    message: 'the histogram min is above its max',
  })
  .default({});
export type HistogramOptions = z.input<typeof histogramOptionsSchema>;

export interface Histogram {
  /** Bin edges, ascending; bin i holds edges[i] ≤ v < edges[i+1] (the last bin includes its right edge). */
  edges: number[];
  counts: number[];
  /** Values left of the first edge and right of the last (when min/max cut the range). */
  below: number;
  above: number;
}

/** Equal-width bins over the finite values (NaN entries are left out). */
export function histogram(values: ArrayLike<number>, options?: HistogramOptions): Histogram {
  const o = parseInput(histogramOptionsSchema, options, 'histogram');
  let lo = Infinity;
  let hi = -Infinity;
  let n = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    if (!Number.isFinite(v)) continue;
    n++;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  const min = o.min ?? (n > 0 ? lo : 0);
  const max = o.max ?? (n > 0 ? hi : 0);
  const bins = max > min ? (o.bins ?? Math.min(50, Math.max(5, Math.ceil(Math.sqrt(n))))) : 1;
  const width = (max - min) / bins;
  const edges = Array.from({ length: bins + 1 }, (_, i) => (i === bins ? max : min + i * width));
  const counts = new Array<number>(bins).fill(0);
  let below = 0;
  let above = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    if (!Number.isFinite(v)) continue;
    if (v < min) below++;
    else if (v > max) above++;
    else counts[width > 0 ? Math.min(bins - 1, Math.floor((v - min) / width)) : 0]!++;
  }
  return { edges, counts, below, above };
}
