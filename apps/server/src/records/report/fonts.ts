import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { woffToSfnt } from './woff.ts';

/**
 * Noto Sans from @fontsource/noto-sans, embedded in every report. Fontsource ships the face
 * split by script (latin, greek, …) as WOFF and WOFF2; the WOFF files are unpacked to TrueType
 * once per process (woff.ts), and each subset is registered as its own font and text is drawn in runs, each run in the subset that covers it
 * (Ω and π come from the greek subset, µ and ± from latin). The subsets' coverage is the
 * package's own `unicode.json`, the ranges a browser would use.
 */

export type Weight = 'regular' | 'bold';

const subsetNames = [
  'latin',
  'latin-ext',
  'greek',
  'greek-ext',
  'cyrillic',
  'cyrillic-ext',
  'vietnamese',
] as const;

interface Subset {
  name: string;
  ranges: [number, number][];
  files: Record<Weight, Buffer>;
}

/**
 * Symbols no subset carries, written the way an engineer would type them rather than as an
 * empty box (the JSON files of the record package keep the original text).
 */
const substitutes: Record<string, string> = {
  '∞': 'inf',
  '≤': '<=',
  '≥': '>=',
  '≠': '!=',
  '≈': '~',
  '→': '->',
  '←': '<-',
  '√': 'sqrt',
  '∠': '/_',
  '∆': 'Δ',
  '✓': 'yes',
  '✗': 'no',
};

const require = createRequire(import.meta.url);
const fontFile = (name: string, weight: Weight) =>
  woffToSfnt(
    readFileSync(
      require.resolve(
        `@fontsource/noto-sans/files/noto-sans-${name}-${weight === 'bold' ? 700 : 400}-normal.woff`,
      ),
    ),
  );

function parseRanges(text: string): [number, number][] {
  return text.split(',').map((part) => {
    const [from = '', to] = part.trim().replace(/^U\+/i, '').split('-');
    const start = parseInt(from, 16);
    return [start, to ? parseInt(to, 16) : start];
  });
}

let loaded: Subset[] | undefined;

/** The font files, read once per process. */
function subsets(): Subset[] {
  if (!loaded) {
    const unicode = JSON.parse(
      readFileSync(require.resolve('@fontsource/noto-sans/unicode.json'), 'utf8'),
    ) as Record<string, string>;
    loaded = subsetNames.map((name) => ({
      name,
      ranges: parseRanges(unicode[name] ?? ''),
      files: { regular: fontFile(name, 'regular'), bold: fontFile(name, 'bold') },
    }));
  }
  return loaded;
}

export const fontName = (subset: string, weight: Weight) => `noto-${weight}-${subset}`;

/** Registers every subset in both weights with the document (pdfkit embeds only those used). */
export function registerFonts(doc: PDFKit.PDFDocument): void {
  for (const s of subsets()) {
    doc.registerFont(fontName(s.name, 'regular'), s.files.regular);
    doc.registerFont(fontName(s.name, 'bold'), s.files.bold);
  }
}

const coverCache = new Map<number, number>();

/** Index of the first subset covering the code point; 0 (latin) when none does. */
function subsetIndexOf(cp: number): number {
  if (cp < 0x100) return 0;
  const hit = coverCache.get(cp);
  if (hit !== undefined) return hit;
  const index = subsets().findIndex((s) => s.ranges.some(([a, b]) => cp >= a && cp <= b));
  const found = Math.max(0, index);
  coverCache.set(cp, found);
  return found;
}

export interface TextRun {
  font: string;
  text: string;
}

/** Only characters the latin subset draws (Latin-1): the case of nearly every string in a report. */
// eslint-disable-next-line no-control-regex
const isLatin1 = (text: string) => /^[\u0000-\u00ff]*$/.test(text);

/** Control characters dropped (a tab becomes two spaces), symbols no subset has replaced. */
export function substituteSymbols(text: string): string {
  // eslint-disable-next-line no-control-regex
  let out = text.replace(/\t/g, '  ').replace(/[\u0000-\u0008\u000b-\u001f\u007f]/g, '');
  if (isLatin1(out)) return out;
  for (const [from, to] of Object.entries(substitutes)) out = out.split(from).join(to);
  return out;
}

/** The text cut into runs that one subset each can draw. */
export function textRuns(text: string, weight: Weight): TextRun[] {
  const clean = substituteSymbols(text);
  const list = subsets();
  if (isLatin1(clean)) return [{ font: fontName('latin', weight), text: clean }];
  const runs: TextRun[] = [];
  let current = -1;
  let buffer = '';
  for (const ch of clean) {
    const index = subsetIndexOf(ch.codePointAt(0)!);
    if (index !== current && buffer !== '') {
      runs.push({ font: fontName(list[current]!.name, weight), text: buffer });
      buffer = '';
    }
    current = index;
    buffer += ch;
  }
  if (buffer !== '') runs.push({ font: fontName(list[current]!.name, weight), text: buffer });
  return runs;
}

/** The text with every character outside the latin subset replaced by a wide latin one: measuring it never underestimates a wrapped height. */
export function latinStandIn(text: string): string {
  // eslint-disable-next-line no-control-regex
  return substituteSymbols(text).replace(/[^\u0000-\u00ff\u2000-\u206f\u2212]/gu, 'W');
}
