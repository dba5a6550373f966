import type { ResultTable } from '@biasproof/shared';
import { appConfig } from '@/config/app-config.ts';

/** The stored results tables the server writes as CSV (`?table=` of results.csv). */
export type StoredResultsTable = ResultTable;

/**
 * GET /api/orgs/:orgId/worksheets/:id/revisions/:letter/results.csv?table=…: one table of the
 * revision's stored results, downloaded straight from this address.
 */
export function resultsCsvUrl(
  orgId: string,
  worksheetId: string,
  letter: string,
  table: StoredResultsTable,
): string {
  return `${appConfig.apiBasePath}/orgs/${encodeURIComponent(orgId)}/worksheets/${encodeURIComponent(worksheetId)}/revisions/${encodeURIComponent(letter)}/results.csv?table=${table}`;
}
