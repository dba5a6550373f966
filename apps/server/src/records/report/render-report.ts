import PDFDocument from 'pdfkit';
import { isSigned, recordMoment, type RecordData } from '../record-data.ts';
import { reportContext } from './context.ts';
import { registerFonts } from './fonts.ts';
import { createLayout, newPage, pageMargins } from './layout.ts';
import { stampPages } from './page-marks.ts';
import { auditSection } from './sections/audit.ts';
import { biasSection } from './sections/bias.ts';
import { cautionSection } from './sections/caution.ts';
import { circuitSection } from './sections/circuit.ts';
import { coverSection, type Generation } from './sections/cover.ts';
import { findingsSection } from './sections/findings.ts';
import { historySection } from './sections/history.ts';
import { plotsSection } from './sections/plots.ts';
import { settingsSection } from './sections/settings.ts';
import { smallSignalSection } from './sections/small-signal.ts';
import { variationSection } from './sections/variation.ts';

export interface ReportOptions {
  generation: Generation;
  /** Deflate page content (default true); tests turn it off to read the drawing operators. */
  compress?: boolean;
}

/**
 * The PDF report of one revision. Everything on its pages comes from `data` except the one
 * generation line on the cover, so two reports of the same revision read the same; the
 * document dates are the record's own, not the time of generation.
 */
export function renderReport(data: RecordData, options: ReportOptions): Promise<Buffer> {
  const ctx = reportContext(data);
  const { worksheet, revision } = data;
  const date = recordMoment(data);
  const doc = new PDFDocument({
    size: 'A4',
    margins: pageMargins,
    bufferPages: true,
    autoFirstPage: true,
    compress: options.compress ?? true,
    info: {
      Title: `${worksheet.title}, revision ${revision.letter}`,
      Author: data.org.name,
      Subject: `Worksheet record, content hash ${revision.contentHash}`,
      Keywords: `${worksheet.projectCode} ${revision.contentHash}`,
      Creator: `Biasproof ${options.generation.appVersion}`,
      Producer: 'Biasproof records (pdfkit)',
      CreationDate: date,
      ModDate: date,
    },
  });
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('data', (chunk: Buffer) => chunks.push(chunk));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  registerFonts(doc);
  const l = createLayout(doc);

  coverSection(l, ctx, options.generation);
  newPage(l);
  circuitSection(l, ctx);
  settingsSection(l, ctx);
  biasSection(l, ctx);
  smallSignalSection(l, ctx);
  plotsSection(l, ctx);
  variationSection(l, ctx);
  findingsSection(l, ctx);
  historySection(l, ctx);
  auditSection(l, ctx);
  cautionSection(l);

  stampPages(doc, {
    owner: `${data.org.name} · worksheet record`,
    subject: `${worksheet.projectCode} · ${worksheet.title} · revision ${revision.letter}`,
    contentHash: revision.contentHash,
    revision: revision.letter,
    signed: isSigned(data),
  });
  doc.end();
  return done;
}
