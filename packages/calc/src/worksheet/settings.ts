import { z } from 'zod';
import { acSweepSchema } from '../circuit.ts';
import { worksheetVariationSchema } from '../variation/worksheet-spec.ts';

/**
 * Analysis settings of a worksheet: which large-signal law the diodes follow, the temperature,
 * which source drives the input and which node is the output, and the figures the small-signal
 * and signal-size views are computed at. Values are SI numbers (V, Ω, Hz, °C, %).
 */

export const diodeLaws = ['exponential', 'ideal', 'constant-drop', 'piecewise-linear'] as const;

const finite = z.number().finite();

export const analysisSettingsSchema = z.object({
  /** Large-signal law of every diode for the bias point. Default `exponential`. */
  diodeLaw: z.enum(diodeLaws).default('exponential'),
  /** Constant-drop law: forward drop, V. Default 0.7 V. */
  constantDrop: z
    .object({ vOn: finite.min(0, 'the drop cannot be negative').max(100).default(0.7) })
    .default({ vOn: 0.7 }),
  /** Piecewise-linear law: knee voltage V0 (V, default 0.6) and slope resistance rD (Ω, default 20). */
  piecewiseLinear: z
    .object({
      v0: finite.min(0, 'the knee cannot be negative').max(100).default(0.6),
      rd: finite.min(0, 'the slope resistance cannot be negative').default(20),
    })
    .default({ v0: 0.6, rd: 20 }),
  /** Circuit temperature, °C. Default 27. */
  temperature: finite
    .gt(-273.15, 'the temperature must be above absolute zero (−273.15 °C)')
    .max(1000, 'the temperature must be at most 1000 °C')
    .default(27),
  /** Name of the independent V or I source that carries the signal; empty when none is chosen. */
  inputSource: z.string().trim().default(''),
  /** Node whose voltage is the output (against ground); empty when none is chosen. */
  outputNode: z.string().trim().default(''),
  /** Frequency sweep of the Bode plot. Default 20 points per decade from 1 Hz to 100 MHz. */
  sweep: acSweepSchema.default({ type: 'dec', points: 20, fstart: 1, fstop: 100e6 }),
  /** Frequency at which gain, input and output impedance are reported, Hz. Default 1 kHz. */
  frequency: finite.min(0, 'the frequency cannot be negative').default(1000),
  /** Peak input amplitude of the signal-size check, V (A for a current source). Default 5 mV. */
  amplitude: finite.positive('the amplitude must be greater than 0').default(5e-3),
  /** Largest acceptable linearity error of the signal-size check, %. Default 10 %. */
  errorLimit: finite
    .positive('the error limit must be greater than 0 %')
    .max(100, 'the error limit must be at most 100 %')
    .default(10),
  /**
   * Tolerances, temperatures, limits, hand checks, ratings and the Monte Carlo run
   * (variation/worksheet-spec.ts). Optional: settings saved without it parse unchanged, and a
   * worksheet without it computes exactly the results it always did.
   */
  variation: worksheetVariationSchema.optional(),
});

export type AnalysisSettings = z.infer<typeof analysisSettingsSchema>;
export type DiodeLawName = AnalysisSettings['diodeLaw'];

/** Settings of a new worksheet. */
export function defaultAnalysisSettings(): AnalysisSettings {
  return analysisSettingsSchema.parse({});
}

/** How each law is named on screen. */
export const diodeLawLabels: Record<DiodeLawName, string> = {
  exponential: 'Exponential (Shockley)',
  ideal: 'Ideal switch',
  'constant-drop': 'Constant drop',
  'piecewise-linear': 'Piecewise-linear',
};
