import type { WorksheetResults } from '@biasproof/calc';

/**
 * Canonical JSON: one text for one value, so that a SHA-256 of it names the content (the
 * revision content hash). Object keys are sorted (JavaScript's default string order), there
 * is no whitespace, numbers are written as JavaScript prints them, and properties whose value
 * is `undefined` are left out, as JSON.stringify does.
 *
 * Plain JSON has no Infinity or NaN (JSON.stringify writes `null`), yet the engine reports
 * ro = Infinity for ideal devices. Non-finite numbers are therefore written as the strings
 * `"Infinity"`, `"-Infinity"` and `"NaN"`; stored and transmitted results use the same
 * encoding (encodeResults) and decodeResults gives the numbers back. Those three strings are
 * reserved as values in results (node and element names there are lowercase, so none clash).
 */
export type JsonValue =
  null | boolean | number | string | JsonValue[] | { [key: string]: JsonValue };

const nonFiniteByText: Record<string, number> = {
  Infinity: Number.POSITIVE_INFINITY,
  '-Infinity': Number.NEGATIVE_INFINITY,
  NaN: Number.NaN,
};

/** A JSON-safe copy of `value` with non-finite numbers written as their reserved strings. */
export function encodeNonFinite(value: unknown): JsonValue {
  if (value === null || typeof value === 'string' || typeof value === 'boolean') return value;
  if (typeof value === 'number') return Number.isFinite(value) ? value : String(value);
  if (Array.isArray(value))
    return value.map((item: unknown) => (item === undefined ? null : encodeNonFinite(item)));
  if (typeof value === 'object') {
    const out: Record<string, JsonValue> = {};
    for (const [key, item] of Object.entries(value)) {
      if (item !== undefined) out[key] = encodeNonFinite(item);
    }
    return out;
  }
  throw new TypeError(`canonical JSON cannot hold a ${typeof value}`);
}

/** The inverse of encodeNonFinite: the reserved strings become numbers again, anywhere in `value`. */
export function decodeNonFinite(value: unknown): unknown {
  if (typeof value === 'string') return value in nonFiniteByText ? nonFiniteByText[value] : value;
  if (Array.isArray(value)) return value.map(decodeNonFinite);
  if (value !== null && typeof value === 'object') {
    return Object.fromEntries(
      Object.entries(value).map(([key, item]) => [key, decodeNonFinite(item)]),
    );
  }
  return value;
}

function write(value: JsonValue): string {
  if (Array.isArray(value)) return `[${value.map(write).join(',')}]`;
  if (value !== null && typeof value === 'object') {
    const keys = Object.keys(value).sort();
    return `{${keys.map((k) => `${JSON.stringify(k)}:${write(value[k] as JsonValue)}`).join(',')}}`;
  }
  return JSON.stringify(value);
}

/** The canonical text of `value` (see the top of this file). */
export function canonicalJson(value: unknown): string {
  return write(encodeNonFinite(value));
}

/** Worksheet results as stored and sent: non-finite numbers written as their reserved strings. */
export type EncodedResults = JsonValue;

export function encodeResults(results: WorksheetResults): EncodedResults {
  return encodeNonFinite(results);
}

/** Results read back from storage or the API, with Infinity and NaN restored. */
export function decodeResults(encoded: unknown): WorksheetResults {
  return decodeNonFinite(encoded) as WorksheetResults;
}
