import { createEvaluator, type Evaluator } from './evaluator.ts';
import type { ResolvedParameter } from './parameters.ts';
import {
  checkSensitivityInput,
  sensitivitiesWith,
  type SensitivityInput,
  type SensitivityResult,
} from './sensitivities.ts';

/**
 * Root-sum-square spread from sensitivities: σ_y = √Σ(∂y/∂xᵢ·σᵢ)², with σᵢ the parameter's
 * standard deviation (a normal tolerance spans `sigmas` σ, default 3; a uniform one of half-width
 * a has σ = a/√3). It is a first-order estimate; the caveat travels with the result.
 */

export const RSS_CAVEAT =
  'RSS is a first-order estimate: it assumes each result changes linearly with each parameter across its tolerance and that the parameters are independent. Where a tolerance is wide, a device changes region, or the result is strongly nonlinear, trust the corners and Monte Carlo instead.';

export interface RssContribution {
  parameter: string;
  /** |∂y/∂x|·σₓ, in the result's unit. */
  sigma: number;
  /** Share of the variance, %. */
  sharePercent: number;
}

export interface RssProbe {
  nominal: number;
  /** Estimated standard deviation of the result; null when a sensitivity is missing. */
  sigma: number | null;
  /** ±3σ_y about nominal. */
  low3Sigma: number | null;
  high3Sigma: number | null;
  /** Linear worst case Σ|∂y/∂xᵢ|·(half-width of xᵢ's tolerance). */
  linearWorstCase: number | null;
  contributions: RssContribution[];
}

export interface RssResult {
  probes: Record<string, RssProbe>;
  caveat: string;
  sensitivities: SensitivityResult;
}

/** A parameter's standard deviation as its distribution defines it. */
export function parameterSigma(p: Pick<ResolvedParameter, 'distribution' | 'spread'>): number {
  return p.distribution === 'normal' ? p.spread : p.spread / Math.sqrt(3);
}

/** RSS from sensitivities already computed with the same evaluator's parameters. */
export function rssFromSensitivities(
  sens: SensitivityResult,
  parameters: readonly ResolvedParameter[],
): RssResult {
  const probes: Record<string, RssProbe> = {};
  for (const path of sens.probes) {
    const nominal = sens.nominal[path]!;
    const entries = sens.byProbe[path]!;
    if (entries.some((e) => e.absolute === null)) {
      probes[path] = {
        nominal,
        sigma: null,
        low3Sigma: null,
        high3Sigma: null,
        linearWorstCase: null,
        contributions: [],
      };
      continue;
    }
    const parts = entries.map((e, i) => ({
      parameter: e.parameter,
      sigma: Math.abs(e.absolute! * parameterSigma(parameters[i]!)),
    }));
    const variance = parts.reduce((s, c) => s + c.sigma * c.sigma, 0);
    const sigma = Math.sqrt(variance);
    const worst = entries.reduce(
      (s, e, i) => s + Math.abs(e.absolute!) * ((parameters[i]!.high - parameters[i]!.low) / 2),
      0,
    );
    probes[path] = {
      nominal,
      sigma,
      low3Sigma: nominal - 3 * sigma,
      high3Sigma: nominal + 3 * sigma,
      linearWorstCase: worst,
      contributions: parts.map((c) => ({
        ...c,
        sharePercent: variance > 0 ? ((c.sigma * c.sigma) / variance) * 100 : 0,
      })),
    };
  }
  return { probes, caveat: RSS_CAVEAT, sensitivities: sens };
}

/** RSS with an evaluator that is already built. */
export function rssWith(ev: Evaluator, relativeStep?: number): RssResult {
  return rssFromSensitivities(sensitivitiesWith(ev, relativeStep), ev.parameters);
}

/** σ of every probed result from the sensitivities and the parameters' tolerances. */
export function rssEstimate(input: SensitivityInput): RssResult {
  const step = checkSensitivityInput(input, 'RSS');
  return rssWith(createEvaluator(input), step);
}
