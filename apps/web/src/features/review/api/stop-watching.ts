import { useMutation, useQueryClient } from '@tanstack/react-query';
import { watchersResponseSchema, type WatchersResponse } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';
import { worksheetApiPath } from '@/features/review/api/review-key.ts';
import { watchersQueryOptions } from '@/features/review/api/get-watchers.ts';

/** DELETE …/worksheets/:id/watchers/me: I no longer receive its signed e-mail (idempotent). */
export function stopWatching(orgId: string, worksheetId: string): Promise<WatchersResponse> {
  return apiRequest(`${worksheetApiPath(orgId, worksheetId)}/watchers/me`, watchersResponseSchema, {
    method: 'DELETE',
  });
}

export function useStopWatching(orgId: string, worksheetId: string) {
  const queryClient = useQueryClient();
  const { queryKey } = watchersQueryOptions(orgId, worksheetId);
  return useMutation({
    mutationFn: () => stopWatching(orgId, worksheetId),
    // The answer is the whole list: show it at once, then read it again like every mutation.
    onSuccess: async (answer) => {
      queryClient.setQueryData(queryKey, answer);
      await queryClient.invalidateQueries({ queryKey });
    },
  });
}
