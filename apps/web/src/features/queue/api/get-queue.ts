import { queryOptions, useQuery } from '@tanstack/react-query';
import { queueResponseSchema } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';

/** GET /api/orgs/:orgId/queue: what waits for the signed-in member, in four lists. */
export function getQueue(orgId: string, signal?: AbortSignal) {
  return apiRequest(
    `/orgs/${encodeURIComponent(orgId)}/queue`,
    queueResponseSchema,
    signal ? { signal } : {},
  );
}

export function queueQueryOptions(orgId: string) {
  return queryOptions({
    queryKey: ['orgs', orgId, 'queue'] as const,
    queryFn: ({ signal }) => getQueue(orgId, signal),
  });
}

export function useQueue(orgId: string) {
  return useQuery(queueQueryOptions(orgId));
}
