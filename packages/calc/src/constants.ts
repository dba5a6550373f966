/**
 * Physical constants of the engine. k and q are exact since the 2019 redefinition of the SI
 * (BIPM, The International System of Units, 9th edition), so VT carries no constant error.
 */

/** Boltzmann constant k, J/K (exact). */
export const BOLTZMANN = 1.380649e-23;
/** Elementary charge q, C (exact). */
export const ELEMENTARY_CHARGE = 1.602176634e-19;
/** k/q, V/K. */
export const BOLTZMANN_OVER_CHARGE = BOLTZMANN / ELEMENTARY_CHARGE;
/** 0 °C in kelvin. */
export const ZERO_CELSIUS_IN_KELVIN = 273.15;
/** Default circuit and nominal temperature, °C (the SPICE convention). */
export const DEFAULT_TEMPERATURE_C = 27;

/** Converts °C to K. */
export function toKelvin(tempC: number): number {
  return tempC + ZERO_CELSIUS_IN_KELVIN;
}

/** Thermal voltage VT = kT/q in V at a temperature in °C (25.852 mV at 300 K). */
export function thermalVoltage(tempC: number): number {
  return BOLTZMANN_OVER_CHARGE * toKelvin(tempC);
}
