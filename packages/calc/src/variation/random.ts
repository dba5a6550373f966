import seedrandom from 'seedrandom';

/**
 * Seeded random numbers for Monte Carlo, reproducible to the bit on any machine and in any
 * JavaScript engine.
 *
 * - Uniforms: seedrandom's `alea` (Johannes Baagøe's Alea), one stream per varied parameter,
 *   seeded with `"<seed>/<parameter id>"`. Alea needs only IEEE-754 additions, multiplications
 *   and integer truncation, which every engine evaluates identically. Per-parameter streams
 *   keep a parameter's draws the same when another parameter is added or removed, so two runs
 *   that differ by one parameter are compared on common random numbers.
 * - Normals: Marsaglia's polar method (G. Marsaglia, T. A. Bray, "A convenient method for
 *   generating normal variables", SIAM Review 6(3), 1964), which needs a logarithm and a square
 *   root but no sine or cosine. `Math.log` is only approximated by the language standard and
 *   engines may round it differently, so the logarithm here is {@link portableLog}, built from
 *   + − × ÷ alone; the square root is IEEE-754's correctly rounded one on every platform.
 *
 * The solved results depend on `Math.exp` inside the device models as well, so they agree
 * across engines to the solver's tolerance, while the drawn parameter values agree exactly.
 */

/** Names the generator in results, so a stored run says how its samples were drawn. */
export const GENERATOR_DESCRIPTION =
  'seedrandom alea, one stream per parameter seeded "<seed>/<parameter>"; normals by Marsaglia\'s polar method with a portable logarithm';

const LN2_HI = 6.9314718036912381649e-1;
const LN2_LO = 1.90821492927058770002e-10;
const SERIES_TERMS = 13;
/** 1/(2k+1): divisions are correctly rounded, so these constants are the same everywhere. */
const ODD_RECIPROCALS = Array.from({ length: SERIES_TERMS }, (_, k) => 1 / (2 * k + 1));
const bits = new DataView(new ArrayBuffer(8));

/**
 * Natural logarithm of a positive normal double using only + − × ÷, so that every engine gives
 * the same bits. x = m·2^e with m in [√½, √2); ln m = 2·atanh(s), s = (m − 1)/(m + 1), whose
 * series in s² (|s| ≤ 0.172) converges below an ulp within 13 terms. Accurate to about 1e-16
 * relative.
 */
export function portableLog(x: number): number {
  if (!(x > 0) || !Number.isFinite(x)) return x === 0 ? -Infinity : NaN;
  bits.setFloat64(0, x);
  const high = bits.getUint32(0);
  let exponent = ((high >>> 20) & 0x7ff) - 1023;
  if (exponent === -1023) return portableLog(x * 2 ** 64) - 64 * (LN2_HI + LN2_LO);
  bits.setUint32(0, (high & 0x000fffff) | 0x3ff00000);
  let m = bits.getFloat64(0);
  if (m > Math.SQRT2) {
    m /= 2;
    exponent += 1;
  }
  // m − 1 is exact for m in [½, 2] (Sterbenz).
  const f = m - 1;
  const s = f / (2 + f);
  const s2 = s * s;
  let series = ODD_RECIPROCALS[SERIES_TERMS - 1]!;
  for (let k = SERIES_TERMS - 2; k >= 0; k--) series = series * s2 + ODD_RECIPROCALS[k]!;
  return exponent * LN2_HI + (exponent * LN2_LO + 2 * s * series);
}

/** A stream of uniform and standard-normal numbers. */
export interface RandomStream {
  /** Uniform in [0, 1). */
  uniform(): number;
  /** Standard normal (mean 0, σ 1). */
  normal(): number;
}

/** The seeded stream of one parameter (see the file comment for the seeding rule). */
export function randomStream(seed: string, stream: string): RandomStream {
  const next = seedrandom.alea(`${seed}/${stream}`);
  let spare = 0;
  let hasSpare = false;
  return {
    uniform: () => next(),
    normal() {
      if (hasSpare) {
        hasSpare = false;
        return spare;
      }
      let u: number;
      let v: number;
      let s: number;
      do {
        u = 2 * next() - 1;
        v = 2 * next() - 1;
        s = u * u + v * v;
      } while (s >= 1 || s === 0);
      const scale = Math.sqrt((-2 * portableLog(s)) / s);
      spare = v * scale;
      hasSpare = true;
      return u * scale;
    },
  };
}
