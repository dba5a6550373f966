import { queryOptions, useQuery } from '@tanstack/react-query';
import { findingListSchema } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';
import { worksheetApiPath, worksheetReviewKey } from '@/features/review/api/review-key.ts';

/** GET …/worksheets/:id/findings: every revision's findings, oldest first, with their threads. */
export function listFindings(orgId: string, worksheetId: string, signal?: AbortSignal) {
  return apiRequest(
    `${worksheetApiPath(orgId, worksheetId)}/findings`,
    findingListSchema,
    signal ? { signal } : {},
  );
}

export function findingsQueryOptions(orgId: string, worksheetId: string) {
  return queryOptions({
    queryKey: [...worksheetReviewKey(orgId, worksheetId), 'findings'] as const,
    queryFn: ({ signal }) => listFindings(orgId, worksheetId, signal),
  });
}

export function useFindings(orgId: string, worksheetId: string) {
  return useQuery(findingsQueryOptions(orgId, worksheetId));
}
