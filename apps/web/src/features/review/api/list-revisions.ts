import { queryOptions, useQuery } from '@tanstack/react-query';
import { revisionHistorySchema } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';
import { worksheetApiPath, worksheetReviewKey } from '@/features/review/api/review-key.ts';

/** GET …/worksheets/:id/revisions: the history, oldest first, with each revision's signatures. */
export function listRevisions(orgId: string, worksheetId: string, signal?: AbortSignal) {
  return apiRequest(
    `${worksheetApiPath(orgId, worksheetId)}/revisions`,
    revisionHistorySchema,
    signal ? { signal } : {},
  );
}

export function revisionsQueryOptions(orgId: string, worksheetId: string) {
  return queryOptions({
    queryKey: [...worksheetReviewKey(orgId, worksheetId), 'revisions'] as const,
    queryFn: ({ signal }) => listRevisions(orgId, worksheetId, signal),
  });
}

export function useRevisions(orgId: string, worksheetId: string) {
  return useQuery(revisionsQueryOptions(orgId, worksheetId));
}
