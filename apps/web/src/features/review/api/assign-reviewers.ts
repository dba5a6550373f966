import { useMutation, useQueryClient } from '@tanstack/react-query';
import { worksheetSchema, type Worksheet } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';
import { worksheetApiPath, worksheetReviewKey } from '@/features/review/api/review-key.ts';

export interface ReviewerAssignment {
  version: number;
  checkerId: string | null;
  approverId: string | null;
}

/**
 * PATCH /api/orgs/:orgId/worksheets/:id with only `checkerId` and `approverId` (the author or a
 * manager): who checks and who signs. 400 names the field of an assignee who may not; 409
 * `stale-version` when the worksheet moved on.
 */
export function assignReviewers(
  orgId: string,
  worksheetId: string,
  body: ReviewerAssignment,
): Promise<Worksheet> {
  return apiRequest(worksheetApiPath(orgId, worksheetId), worksheetSchema, {
    method: 'PATCH',
    body,
  });
}

export function useAssignReviewers(orgId: string, worksheetId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: ReviewerAssignment) => assignReviewers(orgId, worksheetId, body),
    // Submit is blocked until both are assigned: the actions change with the assignment.
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: worksheetReviewKey(orgId, worksheetId) }),
  });
}
