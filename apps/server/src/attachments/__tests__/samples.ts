// Small files of each kind for the attachment tests: real headers, a few bytes of body.
import { createHash } from 'node:crypto';
import { fixturePng, systemRows } from '../../test-support/fixtures.ts';
import type { OrgApi } from '../../test-support/team.ts';
import type { TestApp } from '../../test-support/test-app.ts';

export const samples = {
  /** A minimal one-page PDF (its `%PDF-` header is all the sniffer reads). */
  pdf: () =>
    Buffer.from(
      '%PDF-1.7\n1 0 obj <</Type /Catalog /Pages 2 0 R>> endobj\n' +
        '2 0 obj <</Type /Pages /Kids [] /Count 0>> endobj\ntrailer <</Root 1 0 R>>\n%%EOF\n',
      'latin1',
    ),
  png: fixturePng,
  /** JPEG start of image and a JFIF APP0 marker. */
  jpeg: () => Buffer.from('ffd8ffe000104a46494600010100000100010000ffd9', 'hex'),
  csv: () => Buffer.from('f_Hz,gain_dB\n10,20.1\n100,20.0\n1000,19.7\n', 'utf8'),
  deck: () => Buffer.from('divider\nV1 in 0 9\nR1 in out 2k2\nR2 out 0 1k\n.op\n.end\n', 'utf8'),
  svg: () =>
    Buffer.from(
      '<?xml version="1.0"?>\n<svg xmlns="http://www.w3.org/2000/svg" onload="alert(1)"/>\n',
      'utf8',
    ),
};

/** Multipart upload of one file (and an optional finding) as one signed-in person. */
export function upload(
  api: OrgApi,
  worksheetId: string,
  file: { name: string; content: Buffer },
  fields: { findingId?: string } = {},
) {
  const req = api.agent
    .post(api.url(`/worksheets/${worksheetId}/attachments`))
    .set('x-csrf-token', api.csrf);
  if (fields.findingId) void req.field('findingId', fields.findingId);
  return req.attach('file', file.content, file.name);
}

export const sha256Hex = (bytes: Buffer) => createHash('sha256').update(bytes).digest('hex');

/** The stored rows of one worksheet's attachments, with what PostgreSQL says of the bytes. */
export function storedAttachments(t: TestApp, worksheetId: string) {
  return systemRows<{
    id: string;
    finding_id: string | null;
    revision_letter: string;
    filename: string;
    type: string;
    size: number;
    sha256: string;
    bytes: number;
    content_sha256: string;
    uploaded_by_user_id: string;
  }>(
    t,
    `SELECT id, finding_id, revision_letter, filename, type, size, sha256,
            octet_length(content) AS bytes, encode(sha256(content), 'hex') AS content_sha256,
            uploaded_by_user_id
       FROM attachments WHERE worksheet_id = $1 ORDER BY uploaded_at, id`,
    [worksheetId],
  );
}
