import type { WorksheetListQuery } from '@biasproof/shared';
import { appConfig } from '@/config/app-config.ts';
import { toQueryString } from '@/lib/api/query-string.ts';

/** The list's filters and sort, without paging: the export holds every matching row. */
export type WorksheetExportQuery = Omit<WorksheetListQuery, 'limit' | 'offset'>;

/**
 * GET /api/orgs/:orgId/worksheets/export.csv with the list's filters and sort. The browser
 * downloads it straight from this address (same origin, the session cookie goes along).
 */
export function worksheetsExportUrl(orgId: string, query: WorksheetExportQuery): string {
  return `${appConfig.apiBasePath}/orgs/${encodeURIComponent(orgId)}/worksheets/export.csv${toQueryString(query)}`;
}
