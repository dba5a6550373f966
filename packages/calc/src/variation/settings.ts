import type { z } from 'zod';
import { analysisSettingsSchema } from '../worksheet/settings.ts';

/**
 * The analysis settings the variation analyses solve with: the worksheet's own (diode law,
 * temperature, input source, output node, frequency), so a worksheet's settings object can be
 * passed as it is. Every field is optional and takes the worksheet default.
 */
export const evaluationSettingsSchema = analysisSettingsSchema
  .pick({
    diodeLaw: true,
    constantDrop: true,
    piecewiseLinear: true,
    temperature: true,
    inputSource: true,
    outputNode: true,
    frequency: true,
  })
  .default({
    diodeLaw: 'exponential',
    constantDrop: { vOn: 0.7 },
    piecewiseLinear: { v0: 0.6, rd: 20 },
    temperature: 27,
    inputSource: '',
    outputNode: '',
    frequency: 1000,
  });
export type EvaluationSettingsInput = z.input<typeof evaluationSettingsSchema>;
export type EvaluationSettings = z.infer<typeof evaluationSettingsSchema>;
