import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { auditEventSchema, listResponseSchema, type AuditListQuery } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';
import { toQueryString } from '@/lib/api/query-string.ts';

const auditListSchema = listResponseSchema(auditEventSchema);

/** GET /api/orgs/:orgId/audit with filters and paging → `{items,total}`, newest first. */
export function listAuditEvents(orgId: string, query: AuditListQuery, signal?: AbortSignal) {
  return apiRequest(
    `/orgs/${encodeURIComponent(orgId)}/audit${toQueryString(query)}`,
    auditListSchema,
    signal ? { signal } : {},
  );
}

export function auditEventsQueryOptions(orgId: string, query: AuditListQuery) {
  return queryOptions({
    queryKey: ['orgs', orgId, 'audit', 'events', query] as const,
    queryFn: ({ signal }) => listAuditEvents(orgId, query, signal),
    placeholderData: keepPreviousData,
  });
}

export function useAuditEvents(orgId: string, query: AuditListQuery) {
  return useQuery(auditEventsQueryOptions(orgId, query));
}
