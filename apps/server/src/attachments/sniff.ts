import { parseDeck } from '@biasproof/calc';
import { MAX_DRAFT_BYTES, type AttachmentType } from '@biasproof/shared';

// What an upload is, decided from its bytes alone: the name and the browser's Content-Type are
// the sender's claims, and serving a file under a claimed type is how stored-XSS slips in.

export interface SniffedType {
  type: AttachmentType;
  /** The Content-Type it is served with. */
  contentType: string;
}

const binarySignatures: { type: AttachmentType; contentType: string; magic: number[] }[] = [
  { type: 'pdf', contentType: 'application/pdf', magic: [...Buffer.from('%PDF-', 'latin1')] },
  {
    type: 'png',
    contentType: 'image/png',
    magic: [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a],
  },
  { type: 'jpeg', contentType: 'image/jpeg', magic: [0xff, 0xd8, 0xff] },
];

const startsWith = (bytes: Uint8Array, magic: number[]) =>
  bytes.length >= magic.length && magic.every((b, i) => bytes[i] === b);

/** The text of valid UTF-8 without NUL bytes (a leading BOM dropped), else null. */
function utf8Text(bytes: Uint8Array): string | null {
  if (bytes.includes(0)) return null;
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    return null;
  }
}

const directiveLine = /^[ \t]*\.(end|op)\b/im;

/**
 * A SPICE deck: the engine's parser reads at least one element from it, or a line is an
 * `.end`/`.op` card. Texts larger than a draft are not parsed (the engine would refuse them).
 */
export function looksLikeDeck(text: string): boolean {
  if (directiveLine.test(text)) return true;
  if (Buffer.byteLength(text) > MAX_DRAFT_BYTES) return false;
  try {
    return parseDeck(text).circuit.elements.length > 0;
  } catch {
    return false;
  }
}

/** Fields per record for one delimiter, honouring double quotes (which may hold newlines). */
function fieldCounts(text: string, delimiter: string): number[] {
  const counts: number[] = [];
  let fields = 1;
  let empty = true;
  let quoted = false;
  for (const ch of text) {
    if (ch === '"') quoted = !quoted;
    if (quoted) {
      empty = false;
      continue;
    }
    if (ch === '\n') {
      if (!empty) counts.push(fields);
      fields = 1;
      empty = true;
    } else if (ch === delimiter) {
      fields += 1;
      empty = false;
    } else if (ch !== '\r') {
      empty = false;
    }
  }
  if (!empty) counts.push(fields);
  return quoted ? [] : counts;
}

/** CSV: every non-blank record has the same number (≥ 2) of fields for one of `,` `;` tab. */
export function looksLikeCsv(text: string): boolean {
  return [',', ';', '\t'].some((delimiter) => {
    const counts = fieldCounts(text, delimiter);
    const first = counts[0];
    return first !== undefined && first >= 2 && counts.every((n) => n === first);
  });
}

/**
 * The attachment type of `bytes`, or null when it is none of PDF, PNG, JPEG, a SPICE deck or
 * CSV. Markup (anything whose text starts with `<`: SVG, HTML, XML) is never text here.
 */
export function sniffAttachmentType(bytes: Uint8Array): SniffedType | null {
  for (const { type, contentType, magic } of binarySignatures) {
    if (startsWith(bytes, magic)) return { type, contentType };
  }
  const text = utf8Text(bytes);
  if (text === null || text.trim() === '' || text.trimStart().startsWith('<')) return null;
  if (looksLikeDeck(text)) return { type: 'deck', contentType: 'text/plain; charset=utf-8' };
  if (looksLikeCsv(text)) return { type: 'csv', contentType: 'text/csv; charset=utf-8' };
  return null;
}

export const allowedTypesText = 'PDF, PNG, JPEG, CSV or a SPICE deck';

const MAX_FILENAME_CHARS = 200;
// C0/C1 controls, and bidirectional overrides (U+202E turns `evil<U+202E>fdp.exe` into a
// name that reads as `evilexe.pdf`).
// eslint-disable-next-line no-control-regex -- matching control characters is the point
const unsafeChars = /[\u0000-\u001f\u007f-\u009f\u200e\u200f\u202a-\u202e\u2066-\u2069]/gu;

/**
 * The name to store and offer on download: no folders (either slash), no control or
 * direction characters, no leading dots, at most 200 characters with the extension kept;
 * `fallback` when nothing usable is left.
 */
export function sanitizeFilename(raw: string, fallback = 'attachment'): string {
  const base = raw.split(/[/\\]/).pop() ?? '';
  const cleaned = base.replace(unsafeChars, '').normalize('NFC').trim().replace(/^\.+/, '').trim();
  const chars = [...cleaned];
  if (chars.length === 0) return fallback;
  if (chars.length <= MAX_FILENAME_CHARS) return chars.join('');
  const dot = cleaned.lastIndexOf('.');
  const ext = dot > 0 ? [...cleaned.slice(dot)] : [];
  const keepExt = ext.length > 1 && ext.length <= 16 ? ext : [];
  return chars.slice(0, MAX_FILENAME_CHARS - keepExt.length).join('') + keepExt.join('');
}
