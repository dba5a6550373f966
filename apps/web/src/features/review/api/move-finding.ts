import { useMutation, useQueryClient } from '@tanstack/react-query';
import { findingSchema, type Finding } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';
import { worksheetReviewKey } from '@/features/review/api/review-key.ts';

/** `answer` (the author: open → answered), `close` and `reopen` (a checker). */
export type FindingStep = 'answer' | 'close' | 'reopen';

/** POST /api/orgs/:orgId/findings/:findingId/{answer|close|reopen} with `{text}`. */
export function moveFinding(
  orgId: string,
  findingId: string,
  step: FindingStep,
  text: string,
): Promise<Finding> {
  return apiRequest(
    `/orgs/${encodeURIComponent(orgId)}/findings/${encodeURIComponent(findingId)}/${step}`,
    findingSchema,
    { method: 'POST', body: { text } },
  );
}

export function useMoveFinding(orgId: string, worksheetId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({
      findingId,
      step,
      text,
    }: {
      findingId: string;
      step: FindingStep;
      text: string;
    }) => moveFinding(orgId, findingId, step, text),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: worksheetReviewKey(orgId, worksheetId) }),
  });
}
