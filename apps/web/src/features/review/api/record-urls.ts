import { appConfig } from '@/config/app-config.ts';
import { worksheetApiPath } from '@/features/review/api/review-key.ts';

/**
 * Where the browser downloads a revision's records. Plain same-origin GETs: the session cookie
 * goes with them and the server answers `Content-Disposition: attachment`, so a link does it.
 */
function revisionFileUrl(orgId: string, worksheetId: string, letter: string, file: string) {
  return `${appConfig.apiBasePath}${worksheetApiPath(orgId, worksheetId)}/revisions/${encodeURIComponent(letter)}/${file}`;
}

/** GET …/revisions/:letter/report.pdf: the revision's report (marked NOT SIGNED until signed). */
export function reportPdfUrl(orgId: string, worksheetId: string, letter: string): string {
  return revisionFileUrl(orgId, worksheetId, letter, 'report.pdf');
}

/** GET …/revisions/:letter/record.zip: the report, inputs, results, signatures and files with a manifest. */
export function recordPackageUrl(orgId: string, worksheetId: string, letter: string): string {
  return revisionFileUrl(orgId, worksheetId, letter, 'record.zip');
}
