import type { Signature } from '@biasproof/shared';
import type { ReportContext } from '../context.ts';
import {
  colors,
  drawText,
  ensureSpace,
  heading,
  keyValues,
  lineHeight,
  paragraph,
  spacer,
  textHeight,
  type Layout,
} from '../layout.ts';
import { stateLabels } from '../labels.ts';
import { CAUTION } from './caution.ts';

export interface Generation {
  at: Date;
  /** Who asked for the report. */
  by: string;
  appVersion: string;
}

/** The one line that differs between two reports of the same revision. */
export function generationLine(ctx: ReportContext, g: Generation): string {
  return `Generated ${ctx.time(g.at.toISOString())} for ${g.by} by Biasproof ${g.appVersion}`;
}

function signatureBlock(l: Layout, ctx: ReportContext, s: Signature): void {
  const hashNote =
    s.contentHash === ctx.data.revision.contentHash
      ? 'the content hash of this revision'
      : `content hash ${s.contentHash}, which differs from this revision's`;
  const lines: [string, string][] = [
    ['Printed name', s.printedName],
    ['Signed', `${ctx.time(s.signedAt)} (${ctx.zone})`],
    ['Meaning', s.meaning],
    ['Signed content', hashNote],
  ];
  if (s.supersededAt) {
    lines.push(['Superseded', `${ctx.time(s.supersededAt)}, when a later revision was signed`]);
  }
  // Keep one signature's manifestation on one page.
  ensureSpace(l, lines.length * (lineHeight(l.doc) + 2) + 12);
  const top = l.y;
  spacer(l, 4);
  const inner: Layout = { ...l, x: l.x + 8, width: l.width - 16 };
  keyValues(inner, lines, 95);
  l.y = inner.y + 2;
  l.doc
    .rect(l.x, top, 2.5, l.y - top)
    .fillColor(colors.accent)
    .fill();
  spacer(l, 6);
}

function unsignedNotice(l: Layout): void {
  const text =
    'NOT SIGNED. This revision carries no signature: it is not a released record, and its ' +
    'content may still change unless it is frozen.';
  const height = textHeight(l.doc, text, l.width - 16, { size: 10, weight: 'bold' }) + 12;
  l.doc.rect(l.x, l.y, l.width, height).lineWidth(1.2).strokeColor(colors.danger).stroke();
  drawText(l.doc, text, l.x + 8, l.y + 6, l.width - 16, {
    size: 10,
    weight: 'bold',
    color: colors.danger,
  });
  l.y += height + 8;
}

export function coverSection(l: Layout, ctx: ReportContext, g: Generation): void {
  const { data } = ctx;
  const w = data.worksheet;
  const r = data.revision;
  drawText(l.doc, 'Worksheet record', l.x, l.y, l.width, {
    size: 20,
    weight: 'bold',
    color: colors.accent,
  });
  l.y += lineHeight(l.doc, { size: 20, weight: 'bold' });
  paragraph(l, `${w.title}, revision ${r.letter}`, { size: 14, weight: 'bold', after: 10 });

  const frozen = r.frozen
    ? 'Yes: frozen at submission, never changed since'
    : 'No: a draft that may still change';
  const person = (p: { name: string } | null) => p?.name ?? 'not assigned';
  const rows: [string, string][] = [
    ['Organization', data.org.name],
    ['Project', `${w.projectCode}: ${w.projectName}`],
    ['Worksheet', w.title],
  ];
  if (w.description.trim()) rows.push(['Description', w.description]);
  rows.push(
    ['Revision', r.letter],
    ['State', stateLabels[r.state]],
    ['Content hash (SHA-256)', r.contentHash],
    ['Engine version', r.engineVersion],
    ['Revision created', `${ctx.time(r.createdAt)} by ${r.createdBy.name}`],
    ['Frozen', frozen],
    ['Author', w.author.name],
    ['Checker', person(w.checker)],
    ['Approver', person(w.approver)],
    ['Times shown in', `${ctx.zone}, with the offset from UTC`],
  );
  if (!r.isCurrent) {
    rows.push(['Current revision', `${w.revision}; this record is of an earlier revision`]);
  }
  keyValues(l, rows);

  heading(l, 'Signatures');
  if (data.signatures.length === 0) unsignedNotice(l);
  for (const s of data.signatures) signatureBlock(l, ctx, s);

  spacer(l, 6);
  paragraph(l, generationLine(ctx, g), { size: 8, color: colors.muted, after: 8 });
  paragraph(l, CAUTION, { size: 8, color: colors.muted });
}
