import type { ReportContext } from '../context.ts';
import { colors, heading, paragraph, type Layout } from '../layout.ts';
import { table } from '../table.ts';

const MAX_DETAILS = 260;

/** `from=checked, to=signed_off, meaning=Approved for release` (nested values as JSON). */
function detailsText(details: Record<string, unknown>): string {
  const text = Object.entries(details)
    .filter(([k]) => k !== 'worksheetId')
    .map(([k, v]) => `${k}=${typeof v === 'string' ? v : JSON.stringify(v)}`)
    .join(', ');
  return text.length > MAX_DETAILS ? `${text.slice(0, MAX_DETAILS - 1)}…` : text;
}

export function auditSection(l: Layout, ctx: ReportContext): void {
  heading(l, 'Audit events of this worksheet');
  const { auditEvents, revision } = ctx.data;
  paragraph(
    l,
    `${auditEvents.length} events from the organization's hash-chained audit log` +
      (revision.isCurrent ? '' : `, until revision ${revision.letter} was followed by the next`) +
      '. Downloads of this record and its attachments are logged too, but not listed here.',
    { size: 8.5, color: colors.muted, after: 6 },
  );
  if (auditEvents.length === 0) return;
  table(
    l,
    [
      { header: '#', share: 0.5, align: 'right' },
      { header: 'Time', share: 1.9 },
      { header: 'Who', share: 1.3 },
      { header: 'Action', share: 1.7 },
      { header: 'Details', share: 4 },
    ],
    auditEvents.map((e) => [
      String(e.seq),
      ctx.time(e.at),
      e.actor ?? 'system',
      e.action,
      detailsText(e.details),
    ]),
    { size: 7 },
  );
}
