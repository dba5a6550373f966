import { z } from 'zod';

/**
 * An organization's derating policy: the fraction of each rating a part may use in a design
 * (stress ≤ factor × rating), and how far below its rated maximum a junction must stay. Every
 * default says where its number comes from; an organization replaces them with the figures of
 * the standard it works to.
 */

const FILM_RESISTOR_SOURCE =
  'NASA EEE-INST-002 (Instructions for EEE Parts Selection, Screening, Qualification and Derating), resistor derating table: film resistors at 0.60 of rated power up to the derating knee. Recalled and seen quoted; confirm against the issue of the standard you work to.';
const SEMICONDUCTOR_PRACTICE =
  'common practice (from memory; the size of the figures in NASA EEE-INST-002 and similar derating standards). Replace with the figure of the standard you work to.';

const factor = (value: number, source: string) =>
  z
    .object({
      /** Fraction of the rating the part may use, 0 < factor ≤ 1. */
      factor: z
        .number()
        .finite()
        .gt(0, 'a derating factor must be greater than 0')
        .max(1, 'a derating factor is at most 1'),
      /** Where the number comes from. */
      source: z.string().max(500),
    })
    .default({ factor: value, source });

export const deratingPolicySchema = z
  .object({
    name: z.string().max(100).default('Biasproof defaults'),
    resistorPower: factor(0.6, FILM_RESISTOR_SOURCE),
    diodeForwardCurrent: factor(0.5, SEMICONDUCTOR_PRACTICE),
    diodeReverseVoltage: factor(0.7, SEMICONDUCTOR_PRACTICE),
    diodePower: factor(0.5, SEMICONDUCTOR_PRACTICE),
    transistorPower: factor(0.5, SEMICONDUCTOR_PRACTICE),
    transistorCurrent: factor(0.75, SEMICONDUCTOR_PRACTICE),
    transistorVoltage: factor(0.75, SEMICONDUCTOR_PRACTICE),
    junctionTemperature: z
      .object({
        /** How far below the part's rated maximum junction temperature it must stay, K. */
        marginKelvin: z.number().finite().min(0).max(300),
        source: z.string().max(500),
      })
      .default({ marginKelvin: 40, source: SEMICONDUCTOR_PRACTICE }),
  })
  .default({
    name: 'Biasproof defaults',
    resistorPower: { factor: 0.6, source: FILM_RESISTOR_SOURCE },
    diodeForwardCurrent: { factor: 0.5, source: SEMICONDUCTOR_PRACTICE },
    diodeReverseVoltage: { factor: 0.7, source: SEMICONDUCTOR_PRACTICE },
    diodePower: { factor: 0.5, source: SEMICONDUCTOR_PRACTICE },
    transistorPower: { factor: 0.5, source: SEMICONDUCTOR_PRACTICE },
    transistorCurrent: { factor: 0.75, source: SEMICONDUCTOR_PRACTICE },
    transistorVoltage: { factor: 0.75, source: SEMICONDUCTOR_PRACTICE },
    junctionTemperature: { marginKelvin: 40, source: SEMICONDUCTOR_PRACTICE },
  });
export type DeratingPolicyInput = z.input<typeof deratingPolicySchema>;
export type DeratingPolicy = z.infer<typeof deratingPolicySchema>;

/** The default policy, every number with its source. */
export function defaultDeratingPolicy(): DeratingPolicy {
  return deratingPolicySchema.parse(undefined);
}
