import type { DiffEntry, RevisionDiff } from './api/history.ts';
import {
  revisionValues,
  samePathValue,
  type PathValues,
  type RevisionContent,
} from './revision-paths.ts';

// The number-by-number difference of two revisions, over the paths of revision-paths.ts.
export * from './revision-paths.ts';

/** Result numbers that move by less than this relative amount are float noise, not a change. */
export const RESULT_DIFF_TOLERANCE = 1e-9;

function compare(
  before: PathValues,
  after: PathValues,
  tolerance: number,
  prefix: string,
): DiffEntry[] {
  const paths = [...new Set([...before.keys(), ...after.keys()])].sort();
  const entries: DiffEntry[] = [];
  for (const path of paths) {
    const [a, b] = [before.get(path), after.get(path)];
    if (a === undefined || b === undefined) {
      const change = a === undefined ? 'added' : 'removed';
      entries.push({ path: prefix + path, change, before: a ?? null, after: b ?? null });
      continue;
    }
    if (samePathValue(a, b, tolerance)) continue;
    const entry: DiffEntry = { path: prefix + path, change: 'changed', before: a, after: b };
    if (typeof a === 'number' && typeof b === 'number') {
      entry.delta = b - a;
      if (a !== 0) entry.relative = (b - a) / Math.abs(a);
    }
    entries.push(entry);
  }
  return entries;
}

/**
 * What changed from one revision to another: every input that differs at all, and every result
 * that moved by more than `tolerance` (relative), each sorted by path. Result paths carry the
 * prefix `results.`.
 */
export function diffRevisions(
  from: RevisionContent & { letter: string },
  to: RevisionContent & { letter: string },
  tolerance = RESULT_DIFF_TOLERANCE,
): RevisionDiff {
  const [a, b] = [revisionValues(from), revisionValues(to)];
  return {
    from: from.letter,
    to: to.letter,
    inputs: compare(a.inputs, b.inputs, 0, ''),
    results: compare(a.results, b.results, tolerance, 'results.'),
    tolerance,
  };
}
