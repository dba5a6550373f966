import {
  formatSpiceNumber,
  worksheetVariationSchema,
  type Distribution,
  type ESeries,
  type WorksheetVariation,
} from '@biasproof/calc';
import { canonicalJson } from '@biasproof/shared';

/**
 * The variation setup as its table form holds it (text in engineering notation) and the part
 * of the draft's variation section it stands for. Limits, hand checks, the derating policy and
 * the Monte Carlo run are edited elsewhere and pass through untouched.
 */

export type SetupValues = Pick<
  WorksheetVariation,
  'parameters' | 'ratings' | 'temperatures' | 'probes' | 'standardSeries' | 'ambient'
>;

export interface ParameterRowValues {
  target: string;
  toleranceKind: 'percent' | 'range';
  tolerance: string;
  min: string;
  max: string;
  distribution: Distribution;
  sigmas: string;
  tempco: string;
}

export const ratingFields = [
  ['power', 'Power (W)'],
  ['current', 'Current (A)'],
  ['voltage', 'Voltage (V)'],
  ['reverseVoltage', 'Reverse voltage (V)'],
  ['thetaJA', 'θJA (K/W)'],
  ['tjMax', 'Tj max (°C)'],
] as const;
type RatingKey = (typeof ratingFields)[number][0];
export type RatingRowValues = { element: string } & Record<RatingKey, string>;

export interface SetupFormValues {
  parameters: ParameterRowValues[];
  ratings: RatingRowValues[];
  temperatureMode: 'list' | 'range';
  temperatureList: string;
  temperatureFrom: string;
  temperatureTo: string;
  temperatureStep: string;
  probes: string;
  series: ESeries[];
  ambient: string;
}

export function setupOf(v: WorksheetVariation): SetupValues {
  const { parameters, ratings, temperatures, probes, standardSeries, ambient } = v;
  return { parameters, ratings, temperatures, probes, standardSeries, ambient };
}

const spice = (x: number | undefined) => (x === undefined ? '' : formatSpiceNumber(x));

export function newParameterRow(target: string): ParameterRowValues {
  return {
    target,
    toleranceKind: 'percent',
    tolerance: '1',
    min: '',
    max: '',
    distribution: 'normal',
    sigmas: '3',
    tempco: '0',
  };
}

export function newRatingRow(element: string): RatingRowValues {
  return {
    element,
    ...(Object.fromEntries(ratingFields.map(([key]) => [key, ''])) as Record<RatingKey, string>),
  };
}

export function setupFormValues(v: SetupValues): SetupFormValues {
  return {
    parameters: v.parameters.map((p) => ({
      target: p.target,
      toleranceKind: p.min === undefined ? 'percent' : 'range',
      tolerance: p.tolerancePercent === undefined ? '' : String(p.tolerancePercent),
      min: spice(p.min),
      max: spice(p.max),
      distribution: p.distribution,
      sigmas: String(p.sigmas),
      tempco: String(p.tempcoPpm),
    })),
    ratings: v.ratings.map((r) => ({
      element: r.element,
      ...(Object.fromEntries(ratingFields.map(([key]) => [key, spice(r[key])])) as Record<
        RatingKey,
        string
      >),
    })),
    temperatureMode: 'list',
    temperatureList: v.temperatures.join(', '),
    temperatureFrom: '-40',
    temperatureTo: '125',
    temperatureStep: '55',
    probes: v.probes.join(', '),
    series: [...v.standardSeries],
    ambient: v.ambient === undefined ? '' : String(v.ambient),
  };
}

/** True when two setups hold the same content (key order and filled-in defaults aside). */
export function sameSetup(a: SetupValues, b: SetupValues): boolean {
  const full = (s: SetupValues) => setupOf(worksheetVariationSchema.parse(s));
  return canonicalJson(full(a)) === canonicalJson(full(b));
}
