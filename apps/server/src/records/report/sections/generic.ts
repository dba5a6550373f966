import { fmt } from '../../format.ts';

/**
 * Results a report has no dedicated section for (an engine newer than the report, or
 * analyses such as variation that are optional) still appear: as dotted paths and values, the
 * same paths findings use. Long number lists are summarised; results.json has them in full.
 */

export interface FlatRows {
  rows: [string, string][];
  /** Values left out to keep the report readable. */
  omitted: number;
}

const LIST_SUMMARY_AT = 12;

function summary(list: number[]): string {
  const finite = list.filter(Number.isFinite);
  if (finite.length === 0) return `${list.length} values`;
  const min = Math.min(...finite);
  const max = Math.max(...finite);
  const mean = finite.reduce((a, b) => a + b, 0) / finite.length;
  return `${list.length} values: min ${fmt(min, '', 5)}, mean ${fmt(mean, '', 5)}, max ${fmt(max, '', 5)}`;
}

export function flatten(value: unknown, prefix: string, limit = 300): FlatRows {
  const rows: [string, string][] = [];
  let omitted = 0;
  const add = (path: string, text: string) => {
    if (rows.length < limit) rows.push([path, text]);
    else omitted += 1;
  };
  const walk = (v: unknown, path: string): void => {
    if (v === null || v === undefined) add(path, '—');
    else if (typeof v === 'number') add(path, fmt(v, '', 6));
    else if (typeof v === 'string' || typeof v === 'boolean') add(path, String(v));
    else if (Array.isArray(v)) {
      const list = v as unknown[];
      const numbers = list.filter((x): x is number => typeof x === 'number');
      if (list.length > LIST_SUMMARY_AT && numbers.length === list.length)
        add(path, summary(numbers));
      else if (list.length === 0) add(path, 'none');
      else list.forEach((item, i) => walk(item, `${path}.${i}`));
    } else if (typeof v === 'object') {
      const entries = Object.entries(v);
      if (entries.length === 0) add(path, 'none');
      for (const [k, item] of entries) walk(item, path ? `${path}.${k}` : k);
    } else add(path, typeof v);
  };
  walk(value, prefix);
  return { rows, omitted };
}
