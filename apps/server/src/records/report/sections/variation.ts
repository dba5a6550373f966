import type { ReportContext } from '../context.ts';
import { colors, heading, paragraph, type Layout } from '../layout.ts';
import { humanize } from '../labels.ts';
import { table } from '../table.ts';
import { flatten } from './generic.ts';

/** Parts of the results the sections before this one show. */
const shownElsewhere = new Set([
  'status',
  'error',
  'bias',
  'comparison',
  'devices',
  'smallSignal',
  'sweep',
  'signalSize',
  'loadLines',
]);

/**
 * Variation, limits and stress results (temperature sweeps, corners, Monte Carlo, ratings),
 * and anything else the engine adds to its results: one table per part, by dotted path, so
 * a record shows every number it was signed with.
 */
export function variationSection(l: Layout, ctx: ReportContext): void {
  const results = ctx.data.revision.results as unknown as Record<string, unknown>;
  const parts = Object.keys(results)
    .filter((k) => !shownElsewhere.has(k))
    .sort();
  if (parts.length === 0) return;
  heading(l, 'Variation, limits and stress');
  for (const key of parts) {
    heading(l, humanize(key), 2);
    const { rows, omitted } = flatten(results[key], key);
    if (rows.length === 0) {
      paragraph(l, 'No values.', { color: colors.muted });
      continue;
    }
    table(
      l,
      [
        { header: 'Result path', share: 3 },
        { header: 'Value (SI units)', share: 3 },
      ],
      rows,
      omitted ? { note: `${omitted} more values are in results.json of the record package.` } : {},
    );
  }
}
