import type { AuditListQuery } from '@biasproof/shared';
import { appConfig } from '@/config/app-config.ts';
import { toQueryString } from '@/lib/api/query-string.ts';

/**
 * GET /api/orgs/:orgId/audit/export.csv with the list's filters (no paging): every matching
 * row as CSV. The browser downloads it straight from this address.
 */
export function auditExportUrl(
  orgId: string,
  filters: Omit<AuditListQuery, 'limit' | 'offset'>,
): string {
  return `${appConfig.apiBasePath}/orgs/${encodeURIComponent(orgId)}/audit/export.csv${toQueryString(filters)}`;
}
