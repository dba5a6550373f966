import type { ReportContext } from '../context.ts';
import { heading, keyValues, type Layout } from '../layout.ts';
import { stateLabels } from '../labels.ts';
import { table } from '../table.ts';

export function historySection(l: Layout, ctx: ReportContext): void {
  heading(l, 'Revision history');
  const { history, revision } = ctx.data;
  table(
    l,
    [
      { header: 'Revision', share: 0.8 },
      { header: 'State', share: 1 },
      { header: 'Created', share: 2.4 },
      { header: 'Frozen', share: 0.7 },
      { header: 'Engine', share: 0.9 },
      { header: 'Findings', share: 0.8, align: 'right' },
      { header: 'Signatures', share: 3 },
    ],
    history.map((h) => [
      h.letter === revision.letter ? `${h.letter} (this)` : h.letter,
      stateLabels[h.state],
      `${ctx.time(h.createdAt)} by ${h.createdBy.name}`,
      h.frozen ? 'yes' : 'no',
      h.engineVersion,
      String(h.findingCount),
      h.signatures
        .map((s) => `${s.printedName}, ${s.meaning}, ${ctx.time(s.signedAt)}`)
        .join('; ') || 'none',
    ]),
  );
  heading(l, 'Content hashes (SHA-256)', 2);
  keyValues(
    l,
    history.map((h) => [`Revision ${h.letter}`, h.contentHash]),
    80,
  );
}
