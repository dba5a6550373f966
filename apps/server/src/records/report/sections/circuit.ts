import { fmt } from '../../format.ts';
import type { ReportContext } from '../context.ts';
import {
  colors,
  drawText,
  ensureSpace,
  heading,
  lineHeight,
  paragraph,
  spacer,
  textHeight,
  type Layout,
} from '../layout.ts';
import { kindLabels, nodesText, valueText } from '../labels.ts';
import { table } from '../table.ts';

/** The deck line by line in a light band, wrapped where a line is wider than the page. */
function deckListing(l: Layout, text: string): void {
  const style = { size: 7.5, color: colors.ink } as const;
  const lines = text.replace(/\n$/, '').split('\n');
  lines.forEach((line, i) => {
    const shown = `${String(i + 1).padStart(3, ' ')}  ${line}`;
    const height = textHeight(l.doc, shown, l.width - 8, style);
    ensureSpace(l, height);
    l.doc.rect(l.x, l.y, l.width, height).fillColor(colors.band).fill();
    drawText(l.doc, shown, l.x + 4, l.y, l.width - 8, style);
    l.y += height;
  });
  spacer(l, 8);
}

export function circuitSection(l: Layout, ctx: ReportContext): void {
  const { circuit } = ctx.data.revision.draft;
  heading(l, 'Circuit');
  if (circuit.title.trim()) paragraph(l, `Circuit title: ${circuit.title}`);
  if (circuit.elements.length === 0) {
    paragraph(l, 'The circuit has no elements.');
  } else {
    table(
      l,
      [
        { header: 'Element', share: 1 },
        { header: 'Type', share: 1.6 },
        { header: 'Nodes', share: 3 },
        { header: 'Value', share: 3 },
      ],
      circuit.elements.map((el) => [el.name, kindLabels[el.kind], nodesText(el), valueText(el)]),
      { note: `${circuit.elements.length} elements. Node 0 is ground.` },
    );
  }
  if (circuit.models.length > 0) {
    heading(l, 'Device models', 2);
    table(
      l,
      [
        { header: 'Model', share: 1.2 },
        { header: 'Kind', share: 0.8 },
        { header: 'Parameters (SPICE names, SI units)', share: 6 },
      ],
      circuit.models.map((m) => [
        m.name,
        m.kind,
        Object.entries(m.params)
          .map(([k, v]) => `${k}=${fmt(v, '', 6)}`)
          .join('  ') || 'SPICE defaults',
      ]),
      { note: 'Parameters not listed take the SPICE defaults.' },
    );
  }
  heading(l, 'SPICE deck', 2);
  const { deck } = ctx.data;
  if ('error' in deck) {
    paragraph(l, deck.error, { color: colors.danger });
    return;
  }
  paragraph(
    l,
    'As exported by Biasproof (also circuit.cir in the record package); ngspice and other ' +
      'SPICE-class simulators run it as is.',
    { size: 8, color: colors.muted },
  );
  ensureSpace(l, lineHeight(l.doc, { size: 7.5 }) * 3);
  deckListing(l, deck.text);
}
