import { describe, expect, it } from 'vitest';
import {
  canonicalJson,
  decodeNonFinite,
  decodeResults,
  encodeNonFinite,
  encodeResults,
} from '../api/canonical-json.ts';
import type { WorksheetResults } from '@biasproof/calc';

describe('canonical JSON', () => {
  it('when two objects hold the same content in a different key order, then their texts are equal', () => {
    const a = { b: 1, a: { d: [1, { y: 2, x: 1 }], c: 'z' } };
    const b = { a: { c: 'z', d: [1, { x: 1, y: 2 }] }, b: 1 };
    expect(canonicalJson(a)).toBe(canonicalJson(b));
    expect(canonicalJson(a)).toBe('{"a":{"c":"z","d":[1,{"x":1,"y":2}]},"b":1}');
  });

  it('when arrays differ in order, then the texts differ (order of a list is content)', () => {
    expect(canonicalJson([1, 2])).not.toBe(canonicalJson([2, 1]));
  });

  it('when numbers are written, then they read as JavaScript prints them, without whitespace', () => {
    expect(canonicalJson({ x: 1e-14, y: 0.1 + 0.2, z: 4700, w: -0 })).toBe(
      '{"w":0,"x":1e-14,"y":0.30000000000000004,"z":4700}',
    );
  });

  it('when values are undefined, then object properties are left out and array items become null, as JSON.stringify does', () => {
    expect(canonicalJson({ a: undefined, b: [undefined, 1] })).toBe('{"b":[null,1]}');
  });

  it('when a value is non-finite, then it is written as its reserved string, not as null', () => {
    expect(canonicalJson({ ro: Infinity, g: -Infinity, bad: NaN })).toBe(
      '{"bad":"NaN","g":"-Infinity","ro":"Infinity"}',
    );
  });

  it('when encoded and decoded, then Infinity, -Infinity and NaN come back as numbers', () => {
    const value = { devices: { q1: { ro: Infinity, gm: 0.04 } }, list: [-Infinity, NaN, 'q1'] };
    const back = decodeNonFinite(
      JSON.parse(JSON.stringify(encodeNonFinite(value))),
    ) as typeof value;
    expect(back.devices.q1.ro).toBe(Infinity);
    expect(back.list[0]).toBe(-Infinity);
    expect(Number.isNaN(back.list[1])).toBe(true);
    expect(back).toEqual(value);
  });

  it('when results with an ideal device are stored as JSON, then a read gives Infinity back', () => {
    const results = {
      status: 'failed',
      error: { code: 'x', message: 'm' },
      extra: { ro: Infinity },
    } as unknown as WorksheetResults;
    const stored = JSON.parse(JSON.stringify(encodeResults(results))) as unknown;
    expect(JSON.stringify(stored)).toContain('"ro":"Infinity"');
    expect((decodeResults(stored) as unknown as { extra: { ro: number } }).extra.ro).toBe(Infinity);
  });

  it('when a value cannot be JSON, then encoding refuses it', () => {
    expect(() => canonicalJson({ f: () => 1 })).toThrow(TypeError);
    expect(() => canonicalJson({ n: 1n })).toThrow(TypeError);
  });
});
