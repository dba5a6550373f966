import { queryOptions, useQuery } from '@tanstack/react-query';
import { worksheetSchema } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';

/** GET /api/orgs/:orgId/worksheets/:id: the worksheet with its current revision and stored results. */
export function getWorksheet(orgId: string, worksheetId: string, signal?: AbortSignal) {
  return apiRequest(
    `/orgs/${encodeURIComponent(orgId)}/worksheets/${encodeURIComponent(worksheetId)}`,
    worksheetSchema,
    signal ? { signal } : {},
  );
}

export function worksheetQueryOptions(orgId: string, worksheetId: string) {
  return queryOptions({
    queryKey: ['orgs', orgId, 'worksheets', 'one', worksheetId] as const,
    queryFn: ({ signal }) => getWorksheet(orgId, worksheetId, signal),
    // The editor holds the author's draft; a refetch on focus must not pull it from under them.
    refetchOnWindowFocus: false,
    staleTime: Infinity,
  });
}

export function useWorksheet(orgId: string, worksheetId: string) {
  return useQuery(worksheetQueryOptions(orgId, worksheetId));
}
