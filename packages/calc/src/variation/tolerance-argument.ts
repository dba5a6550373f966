import { EngineError } from '../errors.ts';
import type { VariedParameterInput } from './spec.ts';

/**
 * `NAME=P%` as the command line writes a tolerance: NAME is an element (its value varies) or
 * MODEL.PARAM, P the tolerance in % taken as 3σ of a normal distribution. The % sign may be left
 * out.
 */
export function parseToleranceArgument(text: string): VariedParameterInput {
  const match = /^\s*([^=\s]+)\s*=\s*([0-9]*\.?[0-9]+(?:e[-+]?\d+)?)\s*%?\s*$/i.exec(text);
  if (!match)
    throw new EngineError(
      'bad-option',
      `--tol '${text}': expected NAME=P%, e.g. r1=1% or qn.bf=30%`,
    );
  return {
    target: match[1]!,
    tolerancePercent: Number(match[2]),
    distribution: 'normal',
    sigmas: 3,
  };
}
