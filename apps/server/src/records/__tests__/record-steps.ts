// A worksheet taken through the real API to a signature, and the Debian tools (poppler-utils,
// coreutils, unzip) that read its records back the way an auditor would.
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { inflateSync } from 'node:zlib';
import { expect } from 'vitest';
import { TEST_PASSWORD } from '../../test-support/fixtures.ts';
import { newProject, newWorksheet, type OrgApi, type Team } from '../../test-support/team.ts';
import { amplifierDraft } from '../sample-record.ts';
import { upload } from '../../attachments/__tests__/samples.ts';

/** A PDF or zip body as bytes (supertest keeps unknown types as bytes only with a parser of its own). */
export const download = (api: OrgApi, path: string) =>
  api
    .get(path)
    .buffer(true)
    .parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    });

export interface SignedWorksheet {
  id: string;
  contentHash: string;
}

/**
 * A one-stage common-emitter amplifier with an indicator diode, signed by Abe: Ann authors
 * and attaches a scope capture, Kim raises a finding that Ann answers and Kim closes, Kim
 * accepts, Abe signs "Approved for release".
 */
export async function signedAmplifier(team: Team, title = 'Preamp bias'): Promise<SignedWorksheet> {
  const { ann, kim, abe } = team.as;
  const project = await newProject(ann, { name: 'Tidewater hydrophone' });
  const ws = await newWorksheet(ann, project.id, { title, ...amplifierDraft(1) });
  const ok = (res: { status: number; body: unknown }, status = 200) =>
    expect(res.status, JSON.stringify(res.body)).toBe(status);
  ok(
    await ann.patch(`/worksheets/${ws.id}`, {
      version: 1,
      checkerId: team.people.kim!.id,
      approverId: team.people.abe!.id,
    }),
  );
  ok(
    await upload(ann, ws.id, {
      name: 'scope capture.csv',
      content: Buffer.from('f_Hz,gain_dB\n1000,37.2\n'),
    }),
    201,
  );
  const step = (api: OrgApi, body: object) => api.post(`/worksheets/${ws.id}/transitions`, body);
  ok(await step(ann, { action: 'submit', version: 2 }));
  const finding = await kim.post(`/worksheets/${ws.id}/findings`, {
    path: 'devices.q1.ic',
    severity: 'minor',
    text: 'Is IC within the 1 mA ± 10 % budget?',
  });
  ok(finding, 201);
  const findingId = (finding.body as { id: string }).id;
  ok(
    await ann.post(`/findings/${findingId}/answer`, {
      text: 'Yes: 1.36 mA is the intended point.',
    }),
  );
  ok(await kim.post(`/findings/${findingId}/close`, { text: 'Agreed.' }));
  ok(await step(kim, { action: 'accept', version: 3 }));
  const signed = await step(abe, {
    action: 'sign',
    version: 4,
    meaning: 'Approved for release',
    password: TEST_PASSWORD,
  });
  ok(signed);
  const body = signed.body as { state: string; currentRevision: { contentHash: string } };
  expect(body.state).toBe('signed_off');
  return { id: ws.id, contentHash: body.currentRevision.contentHash };
}

function withTemp<T>(fn: (dir: string) => T): T {
  const dir = mkdtempSync(join(tmpdir(), 'biasproof-record-'));
  try {
    return fn(dir);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** pdftotext's reading of the whole document, or of one page. */
export function pdfText(pdf: Buffer, page?: number): string {
  const range = page ? ['-f', String(page), '-l', String(page)] : [];
  return execFileSync('pdftotext', [...range, '-layout', '-enc', 'UTF-8', '-', '-'], {
    input: pdf,
  }).toString('utf8');
}

/** The same text without the generation line (the one line allowed to differ). */
export const withoutGenerationLine = (text: string) => text.replace(/^\s*Generated .*$/gm, '');

/**
 * Dark pixels in the body of each page (between the header and footer bands, which every page
 * has), rendered by pdftoppm at 40 dpi in grey (PGM).
 */
export function inkPerPage(pdf: Buffer): number[] {
  return withTemp((dir) => {
    writeFileSync(join(dir, 'r.pdf'), pdf);
    execFileSync('pdftoppm', ['-r', '40', '-gray', join(dir, 'r.pdf'), join(dir, 'p')]);
    return readdirSync(dir)
      .filter((f) => f.endsWith('.pgm'))
      .sort()
      .map((f) => {
        const image = readFileSync(join(dir, f));
        // Binary PGM: "P5\n<w> <h>\n<max>\n" then one byte per pixel.
        const header = /^P5\s+(\d+)\s+(\d+)\s+(\d+)\s/.exec(image.toString('latin1', 0, 40))!;
        const [width, height] = [Number(header[1]), Number(header[2])];
        // Header band: the top 70 pt of 842; footer band: the bottom 62 pt.
        const first = Math.ceil((70 / 842) * height) * width;
        const last = Math.floor(((842 - 62) / 842) * height) * width;
        const body = image.subarray(header[0].length + first, header[0].length + last);
        let dark = 0;
        for (const p of body) if (p < 200) dark += 1;
        return dark;
      });
  });
}

/** Every content stream of the PDF, inflated (pdfkit deflates page content). */
export function contentStreams(pdf: Buffer): string[] {
  const text = pdf.toString('latin1');
  const out: string[] = [];
  const re = /stream\r?\n/g;
  for (let m = re.exec(text); m; m = re.exec(text)) {
    const start = m.index + m[0].length;
    const end = text.indexOf('endstream', start);
    try {
      out.push(inflateSync(pdf.subarray(start, end)).toString('latin1'));
    } catch {
      // A font program or an uncompressed stream: not page content.
    }
  }
  return out;
}

/** Unzips a package and runs `sha256sum -c manifest.sha256` in it, after `tamper` may change a file. */
export function verifyPackage(
  zip: Buffer,
  tamper?: (dir: string) => void,
): { ok: boolean; output: string; files: string[] } {
  return withTemp((dir) => {
    writeFileSync(join(dir, 'record.zip'), zip);
    execFileSync('unzip', ['-q', join(dir, 'record.zip'), '-d', join(dir, 'rec')]);
    const rec = join(dir, 'rec');
    tamper?.(rec);
    const run = spawnSync('sha256sum', ['-c', 'manifest.sha256'], { cwd: rec });
    const files = execFileSync('unzip', ['-Z1', join(dir, 'record.zip')])
      .toString('utf8')
      .trim()
      .split('\n');
    return {
      ok: run.status === 0,
      output: `${run.stdout.toString()}${run.stderr.toString()}`,
      files,
    };
  });
}

/** The bytes of one entry of a zip. */
export function zipEntry(zip: Buffer, name: string): Buffer {
  return withTemp((dir) => {
    writeFileSync(join(dir, 'r.zip'), zip);
    return execFileSync('unzip', ['-p', join(dir, 'r.zip'), name]);
  });
}
