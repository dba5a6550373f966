import { queryOptions, useQuery } from '@tanstack/react-query';
import { signatureListSchema } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';
import { worksheetApiPath, worksheetReviewKey } from '@/features/review/api/review-key.ts';

/** GET …/worksheets/:id/signatures: every signature of the worksheet (the manifestations). */
export function listSignatures(orgId: string, worksheetId: string, signal?: AbortSignal) {
  return apiRequest(
    `${worksheetApiPath(orgId, worksheetId)}/signatures`,
    signatureListSchema,
    signal ? { signal } : {},
  );
}

export function signaturesQueryOptions(orgId: string, worksheetId: string) {
  return queryOptions({
    queryKey: [...worksheetReviewKey(orgId, worksheetId), 'signatures'] as const,
    queryFn: ({ signal }) => listSignatures(orgId, worksheetId, signal),
  });
}

export function useSignatures(orgId: string, worksheetId: string) {
  return useQuery(signaturesQueryOptions(orgId, worksheetId));
}
