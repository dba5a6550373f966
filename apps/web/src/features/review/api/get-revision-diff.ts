import { queryOptions, useQuery } from '@tanstack/react-query';
import { revisionDiffSchema } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';
import { toQueryString } from '@/lib/api/query-string.ts';
import { worksheetApiPath, worksheetReviewKey } from '@/features/review/api/review-key.ts';

/** GET …/worksheets/:id/diff?from=A&to=B: inputs and results that differ, number by number. */
export function getRevisionDiff(
  orgId: string,
  worksheetId: string,
  from: string,
  to: string,
  signal?: AbortSignal,
) {
  return apiRequest(
    `${worksheetApiPath(orgId, worksheetId)}/diff${toQueryString({ from, to })}`,
    revisionDiffSchema,
    signal ? { signal } : {},
  );
}

export function revisionDiffQueryOptions(
  orgId: string,
  worksheetId: string,
  from: string,
  to: string,
) {
  return queryOptions({
    queryKey: [...worksheetReviewKey(orgId, worksheetId), 'diff', from, to] as const,
    queryFn: ({ signal }) => getRevisionDiff(orgId, worksheetId, from, to, signal),
    // Frozen revisions never change; the diff of two of them stays right.
    staleTime: 5 * 60_000,
  });
}

/** The diff of two revisions, once both are chosen and differ. */
export function useRevisionDiff(
  orgId: string,
  worksheetId: string,
  from: string | null,
  to: string | null,
) {
  return useQuery({
    ...revisionDiffQueryOptions(orgId, worksheetId, from ?? '', to ?? ''),
    enabled: from !== null && to !== null && from !== to,
  });
}
