import { useMutation, useQueryClient } from '@tanstack/react-query';
import { worksheetSchema, type TransitionRequest, type Worksheet } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';
import { worksheetApiPath, worksheetReviewKey } from '@/features/review/api/review-key.ts';

/**
 * POST …/worksheets/:id/transitions: one workflow step on the version last read. A stale
 * version answers 409 `stale-version`; `sign` with a wrong password 403 `bad-password`.
 */
export function transitionWorksheet(
  orgId: string,
  worksheetId: string,
  body: TransitionRequest,
): Promise<Worksheet> {
  return apiRequest(`${worksheetApiPath(orgId, worksheetId)}/transitions`, worksheetSchema, {
    method: 'POST',
    body,
  });
}

export function useTransitionWorksheet(orgId: string, worksheetId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: TransitionRequest) => transitionWorksheet(orgId, worksheetId, body),
    // A refused step (stale version, refused password) may still have changed what is allowed.
    onSettled: () =>
      queryClient.invalidateQueries({ queryKey: worksheetReviewKey(orgId, worksheetId) }),
  });
}
