import { BOLTZMANN, BOLTZMANN_OVER_CHARGE, ELEMENTARY_CHARGE } from '../constants.ts';

/**
 * Temperature laws shared by the device models, in the forms SPICE uses so that results match a
 * SPICE-class simulator at any .temp.
 */

/** The reference temperature of SPICE's silicon band-gap expressions, K (27 °C). */
export const REFERENCE_TEMPERATURE = 300.15;

/** Silicon band gap at T (K), eV — the empirical expression SPICE uses for MOS temperature scaling. */
export function siliconBandGap(tempK: number): number {
  return 1.16 - (7.02e-4 * tempK * tempK) / (tempK + 1108);
}

/** SPICE's built-in-potential temperature correction term (pbfact) at T (K), V. */
export function potentialCorrection(tempK: number): number {
  const vt = BOLTZMANN_OVER_CHARGE * tempK;
  const arg =
    -siliconBandGap(tempK) / (2 * BOLTZMANN * tempK) +
    1.1150877 / (BOLTZMANN * 2 * REFERENCE_TEMPERATURE);
  return -2 * vt * (1.5 * Math.log(tempK / REFERENCE_TEMPERATURE) + ELEMENTARY_CHARGE * arg);
}

/**
 * Saturation-current temperature factor IS(T)/IS(TNOM) with activation energy EG (eV), exponent
 * XTI and emission coefficient N: exp((T/TNOM − 1)·EG/(N·VT(T)) + (XTI/N)·ln(T/TNOM)).
 * Diodes divide by N; SPICE's BJT passes N = 1.
 */
export function saturationCurrentFactor(
  tempK: number,
  tnomK: number,
  eg: number,
  xti: number,
  n: number,
): number {
  const vt = BOLTZMANN_OVER_CHARGE * tempK;
  const ratio = tempK / tnomK;
  return Math.exp(((ratio - 1) * eg) / (n * vt) + (xti / n) * Math.log(ratio));
}
