import { createHash } from 'node:crypto';
import yazl from 'yazl';
import type { RecordData } from '../record-data.ts';

/**
 * The record package: the report with the data it was made from, and a manifest that
 * `sha256sum -c manifest.sha256` checks with nothing but standard tools.
 */

export interface PackageFile {
  /** Path inside the zip, `/`-separated. */
  path: string;
  content: Buffer;
}

export interface PackageAttachment {
  filename: string;
  content: Buffer;
}

const json = (value: unknown) => Buffer.from(`${JSON.stringify(value, null, 2)}\n`, 'utf8');

export const sha256Hex = (b: Buffer) => createHash('sha256').update(b).digest('hex');

/**
 * A file name that stays one plain entry in the zip and one plain line in the manifest:
 * no directories, no leading dots, no backslash or line break (sha256sum escapes those).
 */
export function safeEntryName(name: string): string {
  const cleaned = name
    // eslint-disable-next-line no-control-regex
    .replace(/[\u0000-\u001f\u007f\\/:*?"<>|]/g, '_')
    .replace(/^[.\s]+/, '')
    .trim()
    .slice(0, 120);
  return cleaned || 'attachment';
}

/** Names made unique by a counter before the extension: `scope.png`, `scope (2).png`. */
function uniqueNames(names: string[]): string[] {
  const seen = new Set<string>();
  return names.map((name) => {
    let candidate = name;
    const dot = name.lastIndexOf('.');
    const [stem, ext] = dot > 0 ? [name.slice(0, dot), name.slice(dot)] : [name, ''];
    for (let n = 2; seen.has(candidate.toLowerCase()); n++) candidate = `${stem} (${n})${ext}`;
    seen.add(candidate.toLowerCase());
    return candidate;
  });
}

/** The files of the package, manifest excluded, in a fixed order. */
export function packageFiles(
  data: RecordData,
  report: Buffer,
  attachments: PackageAttachment[],
): PackageFile[] {
  const { revision, worksheet } = data;
  const files: PackageFile[] = [
    { path: 'report.pdf', content: report },
    {
      path: 'revision.json',
      content: json({
        organization: data.org.name,
        project: { code: worksheet.projectCode, name: worksheet.projectName },
        worksheet: { id: worksheet.id, title: worksheet.title, description: worksheet.description },
        revision: revision.letter,
        state: revision.state,
        frozen: revision.frozen,
        engineVersion: revision.engineVersion,
        contentHash: revision.contentHash,
        createdAt: revision.createdAt,
        createdBy: revision.createdBy,
        circuit: revision.draft.circuit,
        settings: revision.draft.settings,
      }),
    },
  ];
  if ('text' in data.deck)
    files.push({ path: 'circuit.cir', content: Buffer.from(data.deck.text, 'utf8') });
  files.push(
    { path: 'results.json', content: json(revision.storedResults) },
    { path: 'signatures.json', content: json(data.signatures) },
    { path: 'findings.json', content: json(data.findings) },
  );
  const names = uniqueNames(attachments.map((a) => safeEntryName(a.filename)));
  attachments.forEach((a, i) =>
    files.push({ path: `attachments/${names[i]!}`, content: a.content }),
  );
  return files;
}

/** `<sha256 hex>  <path>` per file, the format `sha256sum -c` reads. */
export function manifest(files: PackageFile[]): Buffer {
  return Buffer.from(files.map((f) => `${sha256Hex(f.content)}  ${f.path}\n`).join(''), 'utf8');
}

/**
 * The zip, byte for byte the same for the same files: fixed entry times (the revision's own
 * moment, as local DOS fields only, so the server's time zone does not leak in), fixed
 * permissions, entries in the given order.
 */
export function zipPackage(files: PackageFile[], moment: Date): Promise<Buffer> {
  const zip = new yazl.ZipFile();
  const mtime = new Date(
    moment.getUTCFullYear(),
    moment.getUTCMonth(),
    moment.getUTCDate(),
    moment.getUTCHours(),
    moment.getUTCMinutes(),
    moment.getUTCSeconds(),
  );
  const entries = [...files, { path: 'manifest.sha256', content: manifest(files) }];
  for (const f of entries) {
    zip.addBuffer(f.content, f.path, {
      mtime,
      mode: 0o100644,
      forceDosTimestamp: true,
      compress: true,
    });
  }
  zip.end();
  const chunks: Buffer[] = [];
  return new Promise((resolve, reject) => {
    zip.outputStream.on('data', (c: Buffer) => chunks.push(c));
    zip.outputStream.on('end', () => resolve(Buffer.concat(chunks)));
    zip.outputStream.on('error', reject);
  });
}
