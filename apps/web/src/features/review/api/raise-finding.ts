import { useMutation, useQueryClient } from '@tanstack/react-query';
import { findingSchema, type CreateFindingRequest, type Finding } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';
import { worksheetApiPath, worksheetReviewKey } from '@/features/review/api/review-key.ts';

/** POST …/worksheets/:id/findings (a checker): pinned to a path of the current revision. */
export function raiseFinding(
  orgId: string,
  worksheetId: string,
  body: CreateFindingRequest,
): Promise<Finding> {
  return apiRequest(`${worksheetApiPath(orgId, worksheetId)}/findings`, findingSchema, {
    method: 'POST',
    body,
  });
}

export function useRaiseFinding(orgId: string, worksheetId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateFindingRequest) => raiseFinding(orgId, worksheetId, body),
    // A major finding blocks accept and sign: the actions change with the findings.
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: worksheetReviewKey(orgId, worksheetId) }),
  });
}
