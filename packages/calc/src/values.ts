import { EngineError } from './errors.ts';

/**
 * Values as engineers type them, and back.
 *
 * Input follows the SPICE scale-factor rules, because every imported deck is written that way:
 * the letters are case-insensitive, `m` is milli whatever its case, `meg` is mega and `mil` is a
 * thousandth of an inch (25.4 µm). Letters after the scale factor are units and ignored, so
 * `10uF`, `4.7kOhm` and `1megohm` read as SPICE reads them — and, as in SPICE, `1F` is one
 * femtofarad, not one farad.
 *
 * Input also accepts the RKM code of IEC 60062 printed on parts: a letter in place of the decimal
 * point (`4k7` = 4.7 kΩ, `2R2` = 2.2 Ω, `R47` = 0.47 Ω, `4n7` = 4.7 nF). In the RKM form the
 * letter's case matters as in IEC 60062: `1M5` is 1.5 mega, `1m5` is 1.5 milli. This differs from
 * SPICE on purpose — SPICE has no RKM form, and ngspice would read `4k7` as 4 k, silently — so
 * the exporter never writes RKM codes.
 *
 * Output uses SI prefixes (`1.2 kΩ`, `936 µA`), where `M` is mega: formatted text is for reading,
 * not for feeding back into a deck.
 */

export interface ParseValueOptions {
  /**
   * Unit the value is expected in (`Ω`, `F`, `H`, `V`, `A`, `W`, `S`, `Hz`, `s`…). When given,
   * trailing letters must be that unit's symbol or name (`10uF` for `F`, `4k7 ohm` for `Ω`),
   * catching a capacitance typed into a resistor; the error message names the unit. When omitted
   * (default, and what the deck reader uses), trailing letters are ignored as SPICE does.
   */
  unit?: string;
}

/**
 * SPICE scale factors as decimal exponents, longest first so that `meg` and `mil` win over `m`.
 * `mil` has no decimal exponent and is handled apart.
 */
const spiceScales: readonly (readonly [string, number])[] = [
  ['meg', 6],
  ['mil', Number.NaN],
  ['t', 12],
  ['g', 9],
  ['k', 3],
  ['m', -3],
  ['u', -6],
  ['µ', -6],
  ['μ', -6],
  ['n', -9],
  ['p', -12],
  ['f', -15],
];

/** Metres per mil (a thousandth of an inch), as SPICE defines the `mil` scale factor. */
const metresPerMil = 25.4e-6;

/** IEC 60062 RKM letters; case-sensitive where the standard needs it (M mega, m milli). */
const rkmExponent: Record<string, number> = {
  R: 0,
  r: 0,
  k: 3,
  K: 3,
  M: 6,
  G: 9,
  T: 12,
  m: -3,
  u: -6,
  U: -6,
  µ: -6,
  μ: -6,
  n: -9,
  N: -9,
  p: -12,
  P: -12,
};

/** Spelled-out names accepted after a value when a unit is expected (lowercase). */
const unitNames: Record<string, readonly string[]> = {
  Ω: ['ω', 'Ω', 'ohm', 'ohms'],
  F: ['f', 'farad', 'farads'],
  H: ['h', 'henry', 'henries', 'henrys'],
  V: ['v', 'volt', 'volts'],
  A: ['a', 'amp', 'amps', 'ampere', 'amperes'],
  W: ['w', 'watt', 'watts'],
  S: ['s', 'siemens', 'mho'],
  Hz: ['hz', 'hertz'],
  s: ['s', 'sec', 'second', 'seconds'],
};

const spiceNumber = /^([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s?(.*)$/s;
const rkmCode = /^([+-]?)(\d*)([RrKkMGTmUuµμNnPp])(\d+)\s?(.*)$/s;

function badValue(text: string, why: string, unit: string | undefined): EngineError {
  const what = unit ? `value in ${unit}` : 'value';
  return new EngineError('bad-value', `'${text}' is not a ${what}: ${why}`, { token: text });
}

function checkUnitLetters(text: string, rest: string, unit: string | undefined): void {
  if (rest === '') return;
  if (!/^[A-Za-zΩΩµμ°/]+$/.test(rest)) {
    throw badValue(text, `unexpected '${rest}' after the number`, unit);
  }
  if (unit === undefined) return;
  const accepted = unitNames[unit] ?? [unit.toLowerCase()];
  if (!accepted.includes(rest.toLowerCase()) && rest !== unit) {
    throw badValue(text, `it ends in '${rest}' where ${unit} was expected`, unit);
  }
}

function finiteOrThrow(x: number, text: string, unit: string | undefined): number {
  if (!Number.isFinite(x)) throw badValue(text, 'it is out of the range of numbers', unit);
  return x;
}

/** Reads an RKM code (`4k7`, `R47`, `1M5`) or returns undefined when the text is not one. */
function parseRkm(text: string, unit: string | undefined): number | undefined {
  // A letter followed by digits is never a SPICE scale factor, so the two forms cannot clash:
  // `1M` stays SPICE's milli while `1M5` is the IEC 60062 mega.
  const m = rkmCode.exec(text);
  if (!m) return undefined;
  const [, sign = '', whole = '', letter = '', fraction = '', rest = ''] = m;
  const exponent = rkmExponent[letter];
  if (exponent === undefined) return undefined;
  checkUnitLetters(text, rest, unit);
  return finiteOrThrow(Number(`${sign}${whole || '0'}.${fraction}e${exponent}`), text, unit);
}

/**
 * Parses a value in SPICE engineering notation (`4.7k`, `10u`, `1meg`, `2.2n`, `1.5e-3`, `1mil`)
 * or an IEC 60062 RKM code (`4k7`, `2R2`, `1M5`), ignoring trailing unit letters.
 * Throws EngineError `bad-value` naming the text when it is not a finite number.
 */
export function parseValue(text: string, options: ParseValueOptions = {}): number {
  const { unit } = options;
  const trimmed = text.trim();
  if (trimmed === '') throw badValue(text, 'it is empty', unit);

  const rkm = parseRkm(trimmed, unit);
  if (rkm !== undefined) return rkm;

  const m = spiceNumber.exec(trimmed);
  if (!m) {
    throw badValue(
      text,
      'it does not start with a number (write it as 4.7k, 10u, 1meg or 4k7)',
      unit,
    );
  }
  const [, mantissa = '', tail = ''] = m;
  const lower = tail.toLowerCase();
  const scale = spiceScales.find(([prefix]) => lower.startsWith(prefix));
  const [prefix, exponent] = scale ?? ['', 0];
  checkUnitLetters(text, tail.slice(prefix.length), unit);
  if (prefix === 'mil') return finiteOrThrow(Number(mantissa) * metresPerMil, text, unit);
  return finiteOrThrow(scaleDecimal(mantissa, exponent), text, unit);
}

/**
 * Multiplies a decimal number by 10^exponent through its text form, so that `4.7k` is exactly
 * the double nearest 4700 (4.7 * 1000 would give 4700.000000000001).
 */
function scaleDecimal(mantissa: string, exponent: number): number {
  const [digits = '', ownExponent = '0'] = mantissa.split(/[eE]/);
  return Number(`${digits}e${Number(ownExponent) + exponent}`);
}
