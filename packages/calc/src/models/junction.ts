/**
 * The exponential pn-junction current shared by diodes and the BJT's two junctions, exactly in
 * SPICE's form: Shockley's law in forward bias and down to −3·N·VT, and below that a cubic that
 * approaches −IS smoothly (it keeps the conductance positive and finite far in reverse bias).
 */

/** Scratch output of {@link junctionCurrent}: [current A, conductance S]. Reused to avoid allocation. */
export const junctionOut = new Float64Array(2);

/** Writes the junction current and its derivative at v into {@link junctionOut}. */
export function junctionCurrent(v: number, isat: number, nvt: number): void {
  if (v >= -3 * nvt) {
    const e = Math.exp(v / nvt);
    junctionOut[0] = isat * (e - 1);
    junctionOut[1] = (isat * e) / nvt;
  } else {
    let arg = (3 * nvt) / (v * Math.E);
    arg = arg * arg * arg;
    junctionOut[0] = -isat * (1 + arg);
    junctionOut[1] = (isat * 3 * arg) / v;
  }
}
