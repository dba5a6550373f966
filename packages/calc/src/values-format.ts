/**
 * Numbers shown back to people: SI prefixes and units, a fixed number of significant digits,
 * trailing zeros dropped (`936 µA`, `25.9 Ω`, `1.2 kΩ`). `M` here is mega, as SI writes it.
 */

export interface FormatValueOptions {
  /** Significant digits kept (1–15); default 4. */
  digits?: number;
}

/** SI prefixes from femto to tera, indexed by exponent / 3 + 5. */
const prefixes = ['f', 'p', 'n', 'µ', 'm', '', 'k', 'M', 'G', 'T'] as const;
const lowestExponent = -15;
const highestExponent = 12;

/** Units that take no SI prefix: a kilo-decibel or a milli-degree reads wrong. */
const unprefixedUnits = new Set(['dB', '°', '°C', '%', 'K']);

function joinUnit(number: string, prefix: string, unit: string): string {
  const suffix = `${prefix}${unit}`;
  return suffix === '' ? number : `${number} ${suffix}`;
}

function roundToDigits(x: number, digits: number): number {
  return Number(x.toPrecision(digits));
}

/**
 * Formats a value with an SI prefix and unit: `formatValue(9.36e-4, 'A')` → `936 µA`,
 * `formatValue(1200, 'Ω')` → `1.2 kΩ`, `formatValue(0, 'V')` → `0 V`,
 * `formatValue(Infinity, 'Ω')` → `∞ Ω`. Values outside femto…tera use an exponent (`1e-18 A`).
 */
export function formatValue(x: number, unit: string, options: FormatValueOptions = {}): string {
  const digits = Math.min(15, Math.max(1, Math.round(options.digits ?? 4)));
  if (Number.isNaN(x)) return joinUnit('NaN', '', unit);
  if (!Number.isFinite(x)) return joinUnit(x > 0 ? '∞' : '-∞', '', unit);
  if (x === 0) return joinUnit('0', '', unit);
  if (unprefixedUnits.has(unit)) return joinUnit(String(roundToDigits(x, digits)), '', unit);

  let exponent = Math.floor(Math.log10(Math.abs(x)) / 3) * 3;
  let mantissa = roundToDigits(x / 10 ** exponent, digits);
  // log10 and rounding can land one prefix off (999.96 → 1000, or 1e-6 read as 1000 n).
  if (Math.abs(mantissa) >= 1000) {
    exponent += 3;
    mantissa = roundToDigits(x / 10 ** exponent, digits);
  } else if (Math.abs(mantissa) < 1) {
    exponent -= 3;
    mantissa = roundToDigits(x / 10 ** exponent, digits);
  }
  if (exponent < lowestExponent || exponent > highestExponent) {
    const [m = '', e = ''] = roundToDigits(x, digits).toExponential().split('e');
    return joinUnit(`${m}e${Number(e)}`, '', unit);
  }
  const prefix = prefixes[exponent / 3 + 5] ?? '';
  return joinUnit(String(mantissa), prefix, unit);
}
