import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import {
  listResponseSchema,
  worksheetListItemSchema,
  type WorksheetListQuery,
} from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';
import { toQueryString } from '@/lib/api/query-string.ts';

const worksheetListSchema = listResponseSchema(worksheetListItemSchema);

/** Every cached worksheet list of the organization, whatever its filters (for invalidation). */
export function allWorksheetListsKey(orgId: string) {
  return ['orgs', orgId, 'worksheets', 'list'] as const;
}

/** GET /api/orgs/:orgId/worksheets with filters, sort, search and paging → `{items,total}`. */
export function listWorksheets(orgId: string, query: WorksheetListQuery, signal?: AbortSignal) {
  return apiRequest(
    `/orgs/${encodeURIComponent(orgId)}/worksheets${toQueryString(query)}`,
    worksheetListSchema,
    signal ? { signal } : {},
  );
}

export function worksheetsQueryOptions(orgId: string, query: WorksheetListQuery) {
  return queryOptions({
    queryKey: [...allWorksheetListsKey(orgId), query] as const,
    queryFn: ({ signal }) => listWorksheets(orgId, query, signal),
    // A new filter keeps the old rows on screen (marked busy) instead of flashing a skeleton.
    placeholderData: keepPreviousData,
  });
}

export function useWorksheets(orgId: string, query: WorksheetListQuery) {
  return useQuery(worksheetsQueryOptions(orgId, query));
}
