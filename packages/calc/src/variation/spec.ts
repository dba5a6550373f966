import { z } from 'zod';
import { EngineError } from '../errors.ts';

/**
 * What an author varies and checks, as plain data validated by zod at every entry point of the
 * variation analyses. Values are SI numbers (Ω, V, A, W, °C); tolerances and deviations are in
 * percent.
 */

const finite = z.number().finite();

/** How a toleranced parameter is drawn in Monte Carlo. */
export const distributions = ['normal', 'uniform'] as const;
export type Distribution = (typeof distributions)[number];

export const variedParameterSchema = z
  .object({
    /**
     * What varies: an element's name (`r1`: its value; a V or I source's DC value; an E or G
     * source's gain) or `MODEL.PARAM` (`qn.bf`: a parameter of a model card). Case-insensitive.
     */
    target: z
      .string()
      .trim()
      .min(1, 'the varied parameter needs a target (an element name or MODEL.PARAM)'),
    /** Tolerance, ± % of the nominal value. Give this or min/max (or neither, for a temperature coefficient alone). */
    tolerancePercent: finite
      .min(0, 'a tolerance cannot be negative')
      .max(99, 'a tolerance must be below 100 %')
      .optional(),
    /** Lowest value, in the parameter's unit; with max, replaces tolerancePercent. */
    min: finite.optional(),
    /** Highest value, in the parameter's unit. */
    max: finite.optional(),
    /** Monte Carlo distribution. Default `normal`, whose tolerance spans `sigmas` standard deviations. */
    distribution: z.enum(distributions).default('normal'),
    /** How many σ of a normal distribution the tolerance spans. Default 3. */
    sigmas: finite.positive('sigmas must be greater than 0').max(10).default(3),
    /** First-order temperature coefficient about 27 °C, ppm/K. Default 0. */
    tempcoPpm: finite.min(-1e5).max(1e5).default(0),
  })
  .refine((p) => p.tolerancePercent === undefined || (p.min === undefined && p.max === undefined), {
    message: 'give either tolerancePercent or min/max, not both',
  })
  .refine((p) => (p.min === undefined) === (p.max === undefined), {
    message: 'min and max go together',
  })
  .refine((p) => p.min === undefined || p.max === undefined || p.min <= p.max, {
    message: 'min is above max',
  });
export type VariedParameterInput = z.input<typeof variedParameterSchema>;
export type VariedParameter = z.infer<typeof variedParameterSchema>;

/**
 * A result path as the worksheet names its results: `nodes.out`, `sources.v1`,
 * `devices.q1.ic`, `elements.r1.power`, `supplyPower`, `gain.db`, `zin.ohm`… (see result-path.ts).
 */
export const resultPathSchema = z.string().trim().min(1, 'the result path is empty').max(200);

export const limitSchema = z
  .object({
    path: resultPathSchema,
    /** Lowest acceptable value, in `unit`. */
    min: finite.optional(),
    /** Highest acceptable value, in `unit`. */
    max: finite.optional(),
    /** Unit of the result, for display (`V`, `A`, `dB`…). */
    unit: z.string().max(16).default(''),
  })
  .refine((l) => l.min !== undefined || l.max !== undefined, {
    message: 'a limit needs a min, a max or both',
  })
  .refine((l) => l.min === undefined || l.max === undefined || l.min <= l.max, {
    message: 'the limit min is above its max',
  });
export type LimitInput = z.input<typeof limitSchema>;
export type Limit = z.infer<typeof limitSchema>;

export const handCheckSchema = z.object({
  path: resultPathSchema,
  /** The author's hand-calculated value, in the result's unit; not 0 (a % deviation needs it). */
  expected: finite.refine((v) => v !== 0, 'an expected value of 0 has no % deviation'),
  /** Accepted deviation, ± %. Default 5 %. */
  tolerancePercent: finite.positive('the tolerance must be greater than 0 %').default(5),
  /** The author's note (formula, assumption). */
  note: z.string().max(500).default(''),
});
export type HandCheckInput = z.input<typeof handCheckSchema>;
export type HandCheck = z.infer<typeof handCheckSchema>;

export const partRatingSchema = z.object({
  /** Element name (R, D, Q or M). */
  element: z.string().trim().min(1),
  /** Rated power, W. */
  power: finite.positive().optional(),
  /** Rated current (diode forward, collector, drain), A. */
  current: finite.positive().optional(),
  /** Rated voltage (BJT VCE, MOSFET VDS), V. */
  voltage: finite.positive().optional(),
  /** Rated reverse voltage of a diode, V. */
  reverseVoltage: finite.positive().optional(),
  /** Thermal resistance junction (or body) to ambient, K/W; with it the junction temperature is reported. */
  thetaJA: finite.positive().optional(),
  /** Rated maximum junction temperature, °C. */
  tjMax: finite.optional(),
});
export type PartRatingInput = z.input<typeof partRatingSchema>;
export type PartRating = z.infer<typeof partRatingSchema>;

/** Converts a zod failure at an entry point into the engine's `bad-option` error. */
export function parseInput<S extends z.ZodType>(
  schema: S,
  input: unknown,
  what: string,
): z.infer<S> {
  const parsed = schema.safeParse(input);
  if (parsed.success) return parsed.data;
  const issue = parsed.error.issues[0]!;
  const at = issue.path.length > 0 ? ` ${issue.path.join('.')}` : '';
  throw new EngineError('bad-option', `${what}${at}: ${issue.message}`);
}
