import { useMutation, useQueryClient } from '@tanstack/react-query';
import { findingSchema, type Finding } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';
import { worksheetReviewKey } from '@/features/review/api/review-key.ts';

/** POST /api/orgs/:orgId/findings/:findingId/replies: a comment that moves nothing. */
export function replyToFinding(orgId: string, findingId: string, text: string): Promise<Finding> {
  return apiRequest(
    `/orgs/${encodeURIComponent(orgId)}/findings/${encodeURIComponent(findingId)}/replies`,
    findingSchema,
    { method: 'POST', body: { text } },
  );
}

export function useReplyToFinding(orgId: string, worksheetId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ findingId, text }: { findingId: string; text: string }) =>
      replyToFinding(orgId, findingId, text),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: worksheetReviewKey(orgId, worksheetId) }),
  });
}
