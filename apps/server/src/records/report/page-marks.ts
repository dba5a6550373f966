import { colors, drawText, pageMargins, widthOf } from './layout.ts';

export interface PageMarks {
  /** Left of the header: who keeps the record. */
  owner: string;
  /** Right of the header: which worksheet and revision. */
  subject: string;
  contentHash: string;
  /** Revision letter, for the footer. */
  revision: string;
  signed: boolean;
}

/**
 * Header, footer and, on an unsigned revision, the NOT SIGNED mark, on every page. Runs once
 * all content is laid out (pages are buffered), since "page X of Y" needs Y. The page margins
 * are lifted while drawing so pdfkit does not take text in the margin for an overflow.
 */
export function stampPages(doc: PDFKit.PDFDocument, marks: PageMarks): void {
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const saved = doc.page.margins;
    doc.page.margins = { top: 0, bottom: 0, left: 0, right: 0 };
    const { width, height } = doc.page;
    const x = pageMargins.left;
    const inner = width - pageMargins.left - pageMargins.right;

    drawText(doc, marks.owner, x, 26, inner / 2, { size: 8, weight: 'bold', color: colors.muted });
    drawText(doc, marks.subject, x + inner / 2, 26, inner / 2, {
      size: 8,
      color: colors.muted,
      align: 'right',
    });
    drawText(doc, `Content hash (SHA-256) ${marks.contentHash}`, x, 38, inner, {
      size: 7,
      color: colors.muted,
    });
    if (!marks.signed) {
      const label = 'NOT SIGNED';
      const w = widthOf(doc, label, { size: 8, weight: 'bold' });
      drawText(doc, label, x + inner - w, 38, w + 1, {
        size: 8,
        weight: 'bold',
        color: colors.danger,
      });
    }
    doc
      .moveTo(x, 50)
      .lineTo(x + inner, 50)
      .lineWidth(0.4)
      .strokeColor(colors.rule)
      .stroke();

    const footerY = height - pageMargins.bottom + 20;
    doc
      .moveTo(x, footerY - 6)
      .lineTo(x + inner, footerY - 6)
      .lineWidth(0.4)
      .strokeColor(colors.rule)
      .stroke();
    drawText(doc, `Revision ${marks.revision} · ${marks.contentHash}`, x, footerY, inner - 80, {
      size: 7,
      color: colors.muted,
    });
    drawText(doc, `page ${i - range.start + 1} of ${range.count}`, x + inner - 80, footerY, 80, {
      size: 7.5,
      color: colors.muted,
      align: 'right',
    });
    if (!marks.signed) watermark(doc, width, height);
    doc.page.margins = saved;
  }
}

/** A large, light diagonal NOT SIGNED across the page: seen at a glance, the content still reads through it. */
function watermark(doc: PDFKit.PDFDocument, width: number, height: number): void {
  const label = 'NOT SIGNED';
  const size = 64;
  const w = widthOf(doc, label, { size, weight: 'bold' });
  doc.save();
  doc.rotate(-35, { origin: [width / 2, height / 2] });
  doc.fillOpacity(0.1);
  drawText(doc, label, width / 2 - w / 2, height / 2 - size / 2, w + 2, {
    size,
    weight: 'bold',
    color: colors.danger,
  });
  doc.restore();
}
