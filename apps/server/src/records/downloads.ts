import type { OrgContext } from '../orgs/org-scope.ts';
import { listAttachmentsForRevision } from '../attachments/repository.ts';
import { appVersion } from '../version.ts';
import { recordBaseName } from './format.ts';
import { loadRecord, recordMoment, type RecordData } from './record-data.ts';
import { renderReport } from './report/render-report.ts';
import { packageFiles, sha256Hex, zipPackage } from './package/record-package.ts';
import type { ResultTable } from '@biasproof/shared';
import { resultsCsv } from './csv/results-csv.ts';

export interface Download {
  filename: string;
  body: Buffer | string;
}

export interface Requester {
  /** Name printed on the report's generation line. */
  name: string;
}

const baseName = (data: RecordData) =>
  recordBaseName(data.worksheet.projectCode, data.worksheet.title, data.revision.letter);

/**
 * A record leaving the system is logged: which revision, its content hash, and the SHA-256
 * of the exact bytes handed out, so a copy shown later can be matched to its download.
 * Written after the file is built, so a failed build logs nothing.
 */
async function logDownload(
  org: OrgContext,
  action: 'record.report-downloaded' | 'record.package-downloaded',
  data: RecordData,
  bytes: Buffer,
): Promise<void> {
  await org.write((tx) =>
    tx.audit({
      action,
      targetType: 'worksheet',
      targetId: data.worksheet.id,
      details: {
        worksheetId: data.worksheet.id,
        revision: data.revision.letter,
        contentHash: data.revision.contentHash,
        sha256: sha256Hex(bytes),
        bytes: bytes.length,
      },
    }),
  );
}

function generation(requester: Requester) {
  return { at: new Date(), by: requester.name, appVersion };
}

export async function downloadReport(
  org: OrgContext,
  requester: Requester,
  worksheetId: string,
  letter: string,
): Promise<Download> {
  const data = await org.read((tx) => loadRecord(tx, worksheetId, letter));
  const pdf = await renderReport(data, { generation: generation(requester) });
  await logDownload(org, 'record.report-downloaded', data, pdf);
  return { filename: `${baseName(data)}-report.pdf`, body: pdf };
}

export async function downloadPackage(
  org: OrgContext,
  requester: Requester,
  worksheetId: string,
  letter: string,
): Promise<Download> {
  const { data, attachments } = await org.read(async (tx) => {
    const record = await loadRecord(tx, worksheetId, letter);
    return { data: record, attachments: await listAttachmentsForRevision(tx, worksheetId, letter) };
  });
  const pdf = await renderReport(data, { generation: generation(requester) });
  const zip = await zipPackage(packageFiles(data, pdf, attachments), recordMoment(data));
  await logDownload(org, 'record.package-downloaded', data, zip);
  return { filename: `${baseName(data)}-record.zip`, body: zip };
}

export async function downloadResultsCsv(
  org: OrgContext,
  worksheetId: string,
  letter: string,
  table: ResultTable,
): Promise<Download> {
  const data = await org.read((tx) => loadRecord(tx, worksheetId, letter));
  return { filename: `${baseName(data)}-${table}.csv`, body: resultsCsv(data, table) };
}
