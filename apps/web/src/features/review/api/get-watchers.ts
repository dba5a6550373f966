import { queryOptions, useQuery } from '@tanstack/react-query';
import { watchersResponseSchema } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';
import { worksheetApiPath, worksheetReviewKey } from '@/features/review/api/review-key.ts';

/** GET …/worksheets/:id/watchers: whether I watch the worksheet, and everyone who does. */
export function getWatchers(orgId: string, worksheetId: string, signal?: AbortSignal) {
  return apiRequest(
    `${worksheetApiPath(orgId, worksheetId)}/watchers`,
    watchersResponseSchema,
    signal ? { signal } : {},
  );
}

export function watchersQueryOptions(orgId: string, worksheetId: string) {
  return queryOptions({
    queryKey: [...worksheetReviewKey(orgId, worksheetId), 'watchers'] as const,
    queryFn: ({ signal }) => getWatchers(orgId, worksheetId, signal),
  });
}

export function useWatchers(orgId: string, worksheetId: string) {
  return useQuery(watchersQueryOptions(orgId, worksheetId));
}
