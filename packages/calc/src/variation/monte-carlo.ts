import { z } from 'zod';
import type { EngineError } from '../errors.ts';
import {
  createEvaluator,
  engineAttempt,
  parameterRecord,
  probeRecord,
  type EvaluatorInput,
} from './evaluator.ts';
import { parseLimits, withinLimit } from './limits.ts';
import type { ResolvedParameter } from './parameters.ts';
import { GENERATOR_DESCRIPTION, randomStream, type RandomStream } from './random.ts';
import { parseInput, type LimitInput } from './spec.ts';
import {
  histogram,
  sampleStatistics,
  type Histogram,
  type SampleStatistics,
} from './statistics.ts';

/**
 * Monte Carlo over the toleranced parameters: seeded and reproducible (random.ts), run in chunks
 * that report progress and can be cancelled between chunks. A sample that does not converge is
 * counted as failed, reported with its parameter values and counted against the yield; it is
 * never dropped from the count.
 */

export const MAX_MONTE_CARLO_SAMPLES = 100_000;
/** Failed samples reported in full (all of them are counted). */
const REPORTED_FAILURES = 20;

const runSchema = z.object({
  samples: z
    .number()
    .int('samples must be a whole number')
    .min(1, 'samples must be at least 1')
    .max(MAX_MONTE_CARLO_SAMPLES, `samples must be at most ${MAX_MONTE_CARLO_SAMPLES}`),
  seed: z.union([z.string().max(200), z.number().finite()]),
  probes: z.array(z.string()).min(1, 'give at least one result path to probe'),
  chunkSize: z.number().int().min(1).max(MAX_MONTE_CARLO_SAMPLES).default(500),
  histogramBins: z.number().int().min(1).max(1000).optional(),
  keepSamples: z.boolean().default(false),
});

export interface MonteCarloProgress {
  /** Samples solved so far. */
  done: number;
  total: number;
  failed: number;
}

export interface MonteCarloInput extends EvaluatorInput {
  /** Number of samples, 1 to 100 000. */
  samples: number;
  /** Seed; the same seed gives the same samples on any machine. */
  seed: string | number;
  probes: readonly string[];
  /** Limits whose yield is counted; their paths are probed too. */
  limits?: readonly LimitInput[] | undefined;
  /** Samples per chunk between progress reports and cancellation checks. Default 500. */
  chunkSize?: number | undefined;
  /** Histogram bins per probe. Default √n, between 5 and 50. */
  histogramBins?: number | undefined;
  /** Return every sample's probe values (null for a failed sample). Default false. */
  keepSamples?: boolean | undefined;
  onProgress?: ((progress: MonteCarloProgress) => void) | undefined;
  /** Asked before each chunk; true stops the run with the samples solved so far. */
  shouldCancel?: (() => boolean) | undefined;
  /** Stops the run like shouldCancel when aborted. */
  signal?: AbortSignal | undefined;
}

export interface MonteCarloFailure {
  /** 0-based sample index. */
  sample: number;
  code: string;
  message: string;
  element?: string;
  node?: string;
  /** The parameter values that failed, by parameter id. */
  parameters: Record<string, number>;
}

export interface ProbeSummary {
  statistics: SampleStatistics;
  histogram: Histogram;
  /** Every sample's value (null: failed), when keepSamples was set. */
  values?: (number | null)[];
}

export interface LimitYield {
  path: string;
  unit: string;
  min?: number;
  max?: number;
  /** Samples within the limit. */
  passed: number;
  /** passed / samples solved (failed samples count as outside). */
  fraction: number;
}

export interface MonteCarloResult {
  status: 'complete' | 'cancelled';
  seed: string;
  /** How the samples were drawn. */
  generator: string;
  requested: number;
  /** Samples solved (all requested unless cancelled), failed ones included. */
  samples: number;
  /** Samples that could not be solved. */
  failed: number;
  /** Circuit temperature, °C. */
  temperature: number;
  parameters: Pick<
    ResolvedParameter,
    'id' | 'nominal' | 'low' | 'high' | 'center' | 'spread' | 'distribution'
  >[];
  /** Probe values at nominal. */
  nominal: Record<string, number>;
  probes: Record<string, ProbeSummary>;
  /** The first failed samples, with what failed. */
  failures: MonteCarloFailure[];
  /** Yield against the limits; null without limits. */
  yield: { passed: number; fraction: number; limits: LimitYield[] } | null;
}

function failureOf(
  sample: number,
  error: EngineError,
  parameters: Record<string, number>,
): MonteCarloFailure {
  return {
    sample,
    code: error.code,
    message: error.message,
    ...(error.details.element ? { element: error.details.element } : {}),
    ...(error.details.node ? { node: error.details.node } : {}),
    parameters,
  };
}

/** The run's state; both entry points drive it chunk by chunk. */
function startRun(input: MonteCarloInput) {
  const run = parseInput(runSchema, input, 'Monte Carlo');
  const limits = parseLimits(input.limits);
  const probes = [...new Set([...run.probes.map((p) => p.trim()), ...limits.map((l) => l.path)])];
  const ev = createEvaluator({ ...input, probes });
  const seed = String(run.seed);
  const streams: (RandomStream | null)[] = ev.parameters.map((p) =>
    p.spread > 0 ? randomStream(seed, p.id) : null,
  );
  const n = run.samples;
  const columns = probes.map(() => new Float64Array(n).fill(NaN));
  const values = new Float64Array(ev.parameters.length);
  const failures: MonteCarloFailure[] = [];
  let done = 0;
  let failed = 0;

  const step = (count: number): void => {
    const end = Math.min(n, done + count);
    for (; done < end; done++) {
      ev.parameters.forEach((p, i) => {
        const stream = streams[i];
        if (!stream) values[i] = p.center;
        else if (p.distribution === 'normal') values[i] = p.center + p.spread * stream.normal();
        else values[i] = p.center + p.spread * (2 * stream.uniform() - 1);
      });
      const r = engineAttempt(() => ev.evaluate(values));
      if (r.ok) {
        for (let j = 0; j < probes.length; j++) columns[j]![done] = r.value[j]!;
      } else {
        failed++;
        if (failures.length < REPORTED_FAILURES)
          failures.push(failureOf(done, r.error, parameterRecord(ev.parameters, values)));
      }
    }
  };

  const finish = (status: MonteCarloResult['status']): MonteCarloResult => {
    const summaries: Record<string, ProbeSummary> = {};
    probes.forEach((path, j) => {
      const column = columns[j]!.subarray(0, done);
      summaries[path] = {
        statistics: sampleStatistics(column),
        histogram: histogram(
          column,
          run.histogramBins === undefined ? {} : { bins: run.histogramBins },
        ),
        ...(run.keepSamples
          ? { values: Array.from(column, (v) => (Number.isFinite(v) ? v : null)) }
          : {}),
      };
    });
    return {
      status,
      seed,
      generator: GENERATOR_DESCRIPTION,
      requested: n,
      samples: done,
      failed,
      temperature: ev.settings.temperature,
      parameters: ev.parameters.map(({ id, nominal, low, high, center, spread, distribution }) => ({
        id,
        nominal,
        low,
        high,
        center,
        spread,
        distribution,
      })),
      nominal: probeRecord(probes, ev.nominalResults),
      probes: summaries,
      failures,
      yield: limits.length === 0 ? null : yieldOf(limits, probes, columns, done),
    };
  };

  const cancelled = (): boolean =>
    input.shouldCancel?.() === true || input.signal?.aborted === true;
  const progress = (): void => input.onProgress?.({ done, total: n, failed });
  return { step, finish, cancelled, progress, chunk: run.chunkSize, isDone: () => done >= n };
}

function yieldOf(
  limits: ReturnType<typeof parseLimits>,
  probes: string[],
  columns: Float64Array[],
  done: number,
): NonNullable<MonteCarloResult['yield']> {
  const columnOf = (path: string): Float64Array => columns[probes.indexOf(path)]!;
  let passed = 0;
  for (let s = 0; s < done; s++)
    if (limits.every((l) => withinLimit(l, columnOf(l.path)[s]!))) passed++;
  return {
    passed,
    fraction: done > 0 ? passed / done : 0,
    limits: limits.map((l) => {
      const column = columnOf(l.path);
      let ok = 0;
      for (let s = 0; s < done; s++) if (withinLimit(l, column[s]!)) ok++;
      return {
        path: l.path,
        unit: l.unit,
        ...(l.min === undefined ? {} : { min: l.min }),
        ...(l.max === undefined ? {} : { max: l.max }),
        passed: ok,
        fraction: done > 0 ? ok / done : 0,
      };
    }),
  };
}

/**
 * Monte Carlo in one synchronous call (server, CLI, tests). Cancellation is checked between
 * chunks, so shouldCancel must be able to change while the run is going (a worker that wants to
 * react to a message should use {@link runMonteCarloAsync}). Throws EngineError `bad-option` for
 * bad input and when the nominal circuit cannot be solved.
 */
export function runMonteCarlo(input: MonteCarloInput): MonteCarloResult {
  const run = startRun(input);
  while (!run.isDone()) {
    if (run.cancelled()) return run.finish('cancelled');
    run.step(run.chunk);
    run.progress();
  }
  return run.finish('complete');
}

/**
 * Monte Carlo that gives the event loop a turn after every chunk, so that a Web Worker can
 * receive a cancel message (or an AbortSignal can fire) while it runs. Same samples and results
 * as {@link runMonteCarlo}.
 */
export async function runMonteCarloAsync(input: MonteCarloInput): Promise<MonteCarloResult> {
  const run = startRun(input);
  while (!run.isDone()) {
    if (run.cancelled()) return run.finish('cancelled');
    run.step(run.chunk);
    run.progress();
    await new Promise<void>((resolve) => setTimeout(resolve, 0));
  }
  return run.finish('complete');
}
