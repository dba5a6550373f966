/**
 * Principal branch W0 of the Lambert W function for x ≥ 0, from ln x so that the huge
 * arguments of a diode's closed form (exp of V/(N·VT)) do not overflow.
 *
 * Reference: R. M. Corless, G. H. Gonnet, D. E. G. Hare, D. J. Jeffrey, D. E. Knuth,
 * "On the Lambert W function", Advances in Computational Mathematics 5 (1996) 329–359 —
 * Halley's iteration, applied here to g(w) = w + ln w − ln x, whose root is W0(x).
 */
export function lambertW0FromLog(lnX: number): number {
  // Starting point: asymptotic ln x − ln ln x for large x, x itself for small x.
  let w = lnX > 1 ? lnX - Math.log(lnX) : Math.exp(lnX);
  for (let i = 0; i < 100; i++) {
    const g = w + Math.log(w) - lnX;
    const g1 = 1 + 1 / w;
    const g2 = -1 / (w * w);
    const next = w - (2 * g * g1) / (2 * g1 * g1 - g * g2);
    if (Math.abs(next - w) <= 1e-16 * Math.abs(next)) return next;
    w = next;
  }
  return w;
}

/**
 * Exact current of a Shockley diode (IS, N) in series with R across a supply V:
 * I = (N·VT/R)·W0((IS·R/(N·VT))·exp((V + IS·R)/(N·VT))) − IS.
 * Reference: T. C. Banwell, A. Jayakumar, "Exact analytical solution for current flow through
 * diode with series resistance", Electronics Letters 36(4), 2000, pp. 291–292.
 */
export function diodeSeriesCurrent(
  v: number,
  r: number,
  is: number,
  n: number,
  vt: number,
): number {
  const nvt = n * vt;
  const lnX = Math.log((is * r) / nvt) + (v + is * r) / nvt;
  return (nvt / r) * lambertW0FromLog(lnX) - is;
}
