import { describe, expect, it } from 'vitest';
import { EngineError, formatValue, parseValue } from '../src/index.ts';

// Scale factors as every SPICE-class simulator reads them (the ngspice manual, "Syntax of
// numbers"): case-insensitive, M = milli, MEG = mega, MIL = 25.4e-6, letters after them ignored.
const spiceCases: [text: string, value: number][] = [
  ['4.7k', 4700],
  ['10u', 10e-6],
  ['1meg', 1e6],
  ['1MEG', 1e6],
  ['1Meg', 1e6],
  ['2.2n', 2.2e-9],
  ['1.5e-3', 1.5e-3],
  ['1.5E3', 1500],
  ['100p', 100e-12],
  ['1f', 1e-15],
  ['1t', 1e12],
  ['1g', 1e9],
  ['1mil', 25.4e-6],
  ['1m', 1e-3],
  ['1M', 1e-3],
  ['-2.5m', -2.5e-3],
  ['+3', 3],
  ['.5', 0.5],
  ['5.', 5],
  ['10uF', 10e-6],
  ['10µF', 10e-6],
  ['10μ', 10e-6],
  ['4.7kOhm', 4700],
  ['1megohm', 1e6],
  ['3V', 3],
  ['2mA', 2e-3],
  ['1F', 1e-15],
  ['1e-3k', 1],
  [' 12 ', 12],
  ['1 k', 1000],
];

// RKM value codes of IEC 60062: the letter stands for the decimal point and carries the
// multiplier; M is mega and m is milli there, unlike SPICE's case-insensitive M.
const rkmCases: [text: string, value: number][] = [
  ['4k7', 4700],
  ['4K7', 4700],
  ['2R2', 2.2],
  ['R47', 0.47],
  ['1M5', 1.5e6],
  ['1m5', 1.5e-3],
  ['2G2', 2.2e9],
  ['4n7', 4.7e-9],
  ['2p2', 2.2e-12],
  ['4u7', 4.7e-6],
  ['4µ7F', 4.7e-6],
  ['4k7ohm', 4700],
  ['-1k2', -1200],
];

describe('parseValue', () => {
  it.each(spiceCases)('reads %s as SPICE does', (text, value) => {
    expect(parseValue(text)).toBe(value);
  });

  it.each(rkmCases)('reads the IEC 60062 RKM code %s', (text, value) => {
    expect(parseValue(text)).toBe(value);
  });

  it('scales through the decimal text, so 4.7k is exactly 4700 (not 4.7 × 1000)', () => {
    expect(parseValue('1.1k')).toBe(1100);
    expect(parseValue('0.3m')).toBe(0.0003);
  });

  it.each([
    ['', 'is empty'],
    ['   ', 'is empty'],
    ['abc', 'does not start with a number'],
    ['x5', 'does not start with a number'],
    ['1x2', "unexpected 'x2' after the number"],
    ['4.7.1', "unexpected '.1' after the number"],
    ['1k-', "unexpected '-' after the number"],
    ['1e999', 'out of the range of numbers'],
    ['--1', 'does not start with a number'],
  ])('rejects %j with a bad-value error saying it %s', (text, why) => {
    const error = (() => {
      try {
        parseValue(text);
      } catch (e) {
        return e;
      }
      return undefined;
    })();
    expect(error).toBeInstanceOf(EngineError);
    expect((error as EngineError).code).toBe('bad-value');
    expect((error as EngineError).message).toContain(why);
    expect((error as EngineError).details.token).toBe(text);
  });

  it('checks trailing letters against an expected unit', () => {
    expect(parseValue('10uF', { unit: 'F' })).toBe(10e-6);
    expect(parseValue('4k7 ohm', { unit: 'Ω' })).toBe(4700);
    expect(parseValue('4.7kΩ', { unit: 'Ω' })).toBe(4700);
    expect(parseValue('12', { unit: 'V' })).toBe(12);
    expect(() => parseValue('10uV', { unit: 'F' })).toThrow(
      "'10uV' is not a value in F: it ends in 'V' where F was expected",
    );
  });
});

describe('formatValue', () => {
  it.each([
    [9.36e-4, 'A', '936 µA'],
    [25.9, 'Ω', '25.9 Ω'],
    [1200, 'Ω', '1.2 kΩ'],
    [0, 'V', '0 V'],
    [-0.0123456, 'V', '-12.35 mV'],
    [Infinity, 'Ω', '∞ Ω'],
    [-Infinity, 'V', '-∞ V'],
    [1e-6, 'F', '1 µF'],
    [999.96, 'Hz', '1 kHz'],
    [4.7e6, 'Ω', '4.7 MΩ'],
    [1e-18, 'A', '1e-18 A'],
    [3e15, 'Hz', '3e15 Hz'],
    [-20.123456, 'dB', '-20.12 dB'],
    [75, '°C', '75 °C'],
    [4700, '', '4.7 k'],
    [0.5, '', '500 m'],
  ])('formats %d %s as %s', (x, unit, text) => {
    expect(formatValue(x, unit)).toBe(text);
  });

  it('keeps the number of significant digits asked for', () => {
    expect(formatValue(0.025852, 'V', { digits: 3 })).toBe('25.9 mV');
    expect(formatValue(0.025852, 'V', { digits: 6 })).toBe('25.852 mV');
    expect(formatValue(1234.5678, 'Ω', { digits: 2 })).toBe('1.2 kΩ');
  });
});
