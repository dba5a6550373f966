import { useMutation, useQueryClient } from '@tanstack/react-query';
import { watchersResponseSchema, type WatchersResponse } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';
import { worksheetApiPath } from '@/features/review/api/review-key.ts';
import { watchersQueryOptions } from '@/features/review/api/get-watchers.ts';

/** PUT …/worksheets/:id/watchers/me: I receive the worksheet's signed e-mail (idempotent). */
export function startWatching(orgId: string, worksheetId: string): Promise<WatchersResponse> {
  return apiRequest(`${worksheetApiPath(orgId, worksheetId)}/watchers/me`, watchersResponseSchema, {
    method: 'PUT',
  });
}

export function useStartWatching(orgId: string, worksheetId: string) {
  const queryClient = useQueryClient();
  const { queryKey } = watchersQueryOptions(orgId, worksheetId);
  return useMutation({
    mutationFn: () => startWatching(orgId, worksheetId),
    // The answer is the whole list: show it at once, then read it again like every mutation.
    onSuccess: async (answer) => {
      queryClient.setQueryData(queryKey, answer);
      await queryClient.invalidateQueries({ queryKey });
    },
  });
}
