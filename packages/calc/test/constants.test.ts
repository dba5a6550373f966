import { describe, expect, it } from 'vitest';
import { BOLTZMANN, ELEMENTARY_CHARGE, thermalVoltage, toKelvin } from '../src/constants.ts';

// Reference: BIPM, The International System of Units (SI Brochure), 9th edition (2019):
// k = 1.380649e-23 J/K and e = 1.602176634e-19 C exactly.
describe('thermal voltage from the SI 2019 exact constants (BIPM SI Brochure 9th ed.)', () => {
  it('uses the exact defining constants', () => {
    expect(BOLTZMANN).toBe(1.380649e-23);
    expect(ELEMENTARY_CHARGE).toBe(1.602176634e-19);
  });
  it.each([
    // [°C, expected VT in V, tolerance]
    [300 - 273.15, 0.025852, 5e-7], // 25.852 mV at 300 K
    [27, (1.380649e-23 * 300.15) / 1.602176634e-19, 1e-15],
    [27, 0.0258649, 5e-8],
    [-40, (1.380649e-23 * 233.15) / 1.602176634e-19, 1e-15],
  ])('VT(%s °C) = %s V', (tempC, expected, tol) => {
    expect(Math.abs(thermalVoltage(tempC) - expected)).toBeLessThanOrEqual(tol);
  });
  it('converts °C to K with 273.15', () => {
    expect(toKelvin(27)).toBeCloseTo(300.15, 12);
  });
});
