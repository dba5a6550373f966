import { queryOptions, useQuery } from '@tanstack/react-query';
import { availableActionsResponseSchema } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';
import { worksheetApiPath, worksheetReviewKey } from '@/features/review/api/review-key.ts';

/**
 * GET …/worksheets/:id/actions: every workflow action for the caller, allowed or blocked with
 * the reason; the open major findings and the signature meanings of the organization.
 */
export function getAvailableActions(orgId: string, worksheetId: string, signal?: AbortSignal) {
  return apiRequest(
    `${worksheetApiPath(orgId, worksheetId)}/actions`,
    availableActionsResponseSchema,
    signal ? { signal } : {},
  );
}

export function availableActionsQueryOptions(orgId: string, worksheetId: string) {
  return queryOptions({
    queryKey: [...worksheetReviewKey(orgId, worksheetId), 'actions'] as const,
    queryFn: ({ signal }) => getAvailableActions(orgId, worksheetId, signal),
  });
}

export function useAvailableActions(orgId: string, worksheetId: string) {
  return useQuery(availableActionsQueryOptions(orgId, worksheetId));
}
