import { z } from 'zod';
import { deratingPolicySchema } from './derating-policy.ts';
import {
  handCheckSchema,
  limitSchema,
  partRatingSchema,
  resultPathSchema,
  variedParameterSchema,
} from './spec.ts';
import { eSeriesSchema } from './standard-values.ts';

/**
 * The variation section of a worksheet's analysis settings: what the author varies, the limits
 * and hand checks the results must meet, the parts' ratings and the derating policy, and the
 * Monte Carlo run (seed included, so a checker sees exactly the samples the author saw). Every
 * field has a default, and the section itself is optional, so settings stored before it existed
 * parse unchanged.
 */

/** Largest Monte Carlo the stored results hold; larger runs belong to the browser's variation view. */
export const STORED_MONTE_CARLO_SAMPLES = 2000;

const temperature = z
  .number()
  .finite()
  .gt(-273.15, 'a temperature must be above absolute zero')
  .max(1000);

export const worksheetVariationSchema = z.object({
  /** Toleranced parameters (element values, source values, model parameters). */
  parameters: z.array(variedParameterSchema).max(200, 'at most 200 varied parameters').default([]),
  /** Result paths to follow besides those of the limits and hand checks. */
  probes: z.array(resultPathSchema).max(50, 'at most 50 extra result paths').default([]),
  /** Temperatures of the sweep, °C; none: no sweep. */
  temperatures: z.array(temperature).max(50, 'at most 50 temperatures').default([]),
  limits: z.array(limitSchema).max(200, 'at most 200 limits').default([]),
  handChecks: z.array(handCheckSchema).max(200, 'at most 200 hand checks').default([]),
  /** Ratings of the parts whose stress is checked. */
  ratings: z.array(partRatingSchema).max(500).default([]),
  /** The organization's derating policy; default Biasproof's, each number with its source. */
  policy: deratingPolicySchema,
  /** Ambient temperature for junction temperatures, °C. Default the circuit temperature. */
  ambient: temperature.optional(),
  /** Series whose nearest values are suggested. Default E24 and E96. */
  standardSeries: z.array(eSeriesSchema).min(1).max(4).default(['E24', 'E96']),
  monteCarlo: z
    .object({
      /** Samples; 0 runs none. The stored results hold runs of up to 2000 samples. */
      samples: z.number().int().min(0).max(100_000, 'samples must be at most 100000').default(0),
      seed: z.union([z.string().max(200), z.number().finite()]).default('1'),
    })
    .default({ samples: 0, seed: '1' }),
});
export type WorksheetVariationInput = z.input<typeof worksheetVariationSchema>;
export type WorksheetVariation = z.infer<typeof worksheetVariationSchema>;
