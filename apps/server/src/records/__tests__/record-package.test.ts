import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createHash } from 'node:crypto';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { canonicalJson } from '@biasproof/shared';
import { createTestApp } from '../../test-support/test-app.ts';
import { createTeam, type Team } from '../../test-support/team.ts';
import { systemRows } from '../../test-support/fixtures.ts';
import {
  download,
  pdfText,
  signedAmplifier,
  verifyPackage,
  zipEntry,
  type SignedWorksheet,
} from './record-steps.ts';

const sha256 = (b: Buffer | string) => createHash('sha256').update(b).digest('hex');

describe('the record package of a revision', () => {
  const t = createTestApp();
  let team: Team;
  let ws: SignedWorksheet;
  let zip: Buffer;
  beforeAll(async () => {
    team = await createTeam(t);
    ws = await signedAmplifier(team);
    const res = await download(team.as.kim, `/worksheets/${ws.id}/revisions/A/record.zip`);
    expect(res.status).toBe(200);
    zip = res.body as Buffer;
  });
  afterAll(() => t.close());

  it('when a member downloads the package, then it holds the report, deck, data, attachments and a manifest that sha256sum -c accepts, and the download is audited', async () => {
    const { ok, output, files } = verifyPackage(zip);

    expect(ok, output).toBe(true);
    expect(files).toEqual([
      'report.pdf',
      'revision.json',
      'circuit.cir',
      'results.json',
      'signatures.json',
      'findings.json',
      'attachments/scope capture.csv',
      'manifest.sha256',
    ]);
    expect(output.trim().split('\n')).toHaveLength(files.length - 1);
    expect(zipEntry(zip, 'attachments/scope capture.csv').toString()).toBe(
      'f_Hz,gain_dB\n1000,37.2\n',
    );
    expect(zipEntry(zip, 'circuit.cir').toString()).toMatch(/^Q1 c1 b1 e1 QN$/m);
    expect(pdfText(zipEntry(zip, 'report.pdf'))).toContain(ws.contentHash);
    // The data files let anyone recompute the content hash the signature names.
    const revision = JSON.parse(zipEntry(zip, 'revision.json').toString()) as {
      circuit: unknown;
      settings: unknown;
      contentHash: string;
    };
    const results = JSON.parse(zipEntry(zip, 'results.json').toString()) as unknown;
    expect(
      sha256(canonicalJson({ circuit: revision.circuit, settings: revision.settings, results })),
    ).toBe(ws.contentHash);
    const signatures = JSON.parse(zipEntry(zip, 'signatures.json').toString()) as {
      printedName: string;
      meaning: string;
      contentHash: string;
    }[];
    expect(signatures).toEqual([
      expect.objectContaining({
        printedName: 'Abe Fixture',
        meaning: 'Approved for release',
        contentHash: ws.contentHash,
      }),
    ]);
    const findings = JSON.parse(zipEntry(zip, 'findings.json').toString()) as {
      status: string;
      replies: unknown[];
    }[];
    expect(findings).toEqual([
      expect.objectContaining({
        status: 'closed',
        replies: [expect.anything(), expect.anything()],
      }),
    ]);
    const [event] = await systemRows<{ actor_user_id: string; details: Record<string, unknown> }>(
      t,
      `SELECT actor_user_id, details FROM audit_events WHERE org_id = $1 AND action = 'record.package-downloaded' ORDER BY seq`,
      [team.org.id],
    );
    expect(event).toEqual({
      actor_user_id: team.people.kim!.id,
      details: expect.objectContaining({
        revision: 'A',
        contentHash: ws.contentHash,
        sha256: sha256(zip),
      }),
    });
  });

  it('when one byte of one packaged file changes, then sha256sum -c fails and names that file', () => {
    const { ok, output } = verifyPackage(zip, (dir) => {
      const path = join(dir, 'results.json');
      const bytes = readFileSync(path);
      bytes[10] = bytes[10]! ^ 0x01;
      writeFileSync(path, bytes);
    });

    expect(ok).toBe(false);
    expect(output).toMatch(/results\.json: FAILED/);
    expect(output).toMatch(/report\.pdf: OK/);
  });

  it('when the package is downloaded again, then every file but the report (whose generation line differs) is byte for byte the same', async () => {
    const again = (await download(team.as.ann, `/worksheets/${ws.id}/revisions/A/record.zip`))
      .body as Buffer;

    for (const name of [
      'revision.json',
      'circuit.cir',
      'results.json',
      'signatures.json',
      'findings.json',
      'attachments/scope capture.csv',
    ]) {
      expect(zipEntry(again, name).equals(zipEntry(zip, name)), name).toBe(true);
    }
    const manifestLines = (z: Buffer) =>
      zipEntry(z, 'manifest.sha256')
        .toString()
        .split('\n')
        .filter((l) => !l.endsWith('report.pdf'));
    expect(manifestLines(again)).toEqual(manifestLines(zip));
  });
});
