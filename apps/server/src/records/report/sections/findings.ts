import type { RecordFinding } from '../../record-data.ts';
import type { ReportContext } from '../context.ts';
import {
  colors,
  ensureSpace,
  heading,
  lineHeight,
  paragraph,
  spacer,
  type Layout,
} from '../layout.ts';

const replyVerbs: Record<string, string> = {
  answer: 'Answered',
  close: 'Closed',
  reopen: 'Reopened',
  reply: 'Replied',
};

/** How the finding ended, in one line: the last status change with who, when and why. */
function resolution(ctx: ReportContext, f: RecordFinding): string {
  const last = [...f.replies].reverse().find((r) => r.kind !== 'reply');
  const status =
    f.status === 'closed'
      ? 'Closed'
      : f.status === 'answered'
        ? 'Answered, awaiting the checker'
        : 'Open';
  if (!last) return `${status}.`;
  const why = last.text.trim() ? `: “${last.text.trim()}”` : '';
  return `${status} (last step: ${replyVerbs[last.kind] ?? last.kind} by ${last.by.name}, ${ctx.time(last.at)}${why})`;
}

function finding(l: Layout, ctx: ReportContext, f: RecordFinding, index: number): void {
  ensureSpace(l, lineHeight(l.doc) * 5);
  const carried =
    f.revision !== ctx.data.revision.letter ? `, raised on revision ${f.revision}` : '';
  paragraph(l, `F${index + 1}  ${f.severity.toUpperCase()} · ${f.status} · ${f.path}${carried}`, {
    weight: 'bold',
    size: 9.5,
    after: 1,
  });
  paragraph(l, `Raised by ${f.createdBy.name}, ${ctx.time(f.createdAt)}`, {
    size: 8,
    color: colors.muted,
    after: 2,
  });
  paragraph(l, f.text, { indent: 10 });
  for (const r of f.replies) {
    paragraph(l, `${replyVerbs[r.kind] ?? r.kind} by ${r.by.name}, ${ctx.time(r.at)}`, {
      indent: 20,
      size: 8,
      weight: 'bold',
      color: colors.muted,
      after: 1,
    });
    if (r.text.trim()) paragraph(l, r.text, { indent: 20, size: 8.5 });
  }
  paragraph(l, `Resolution: ${resolution(ctx, f)}`, {
    indent: 10,
    size: 8.5,
    color: f.status === 'closed' ? colors.ink : colors.danger,
  });
  spacer(l, 8);
}

export function findingsSection(l: Layout, ctx: ReportContext): void {
  heading(l, 'Findings');
  const list = ctx.data.findings;
  if (list.length === 0) {
    paragraph(l, 'No findings were raised on this revision or an earlier one.', {
      color: colors.muted,
    });
    return;
  }
  const open = list.filter((f) => f.status !== 'closed').length;
  paragraph(
    l,
    `${list.length} finding${list.length === 1 ? '' : 's'} raised on this revision or an earlier one; ${open} not closed. Each is pinned to a dotted path in the results or the circuit.`,
    { size: 8.5, color: colors.muted, after: 6 },
  );
  list.forEach((f, i) => finding(l, ctx, f, i));
}
