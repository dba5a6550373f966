import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest, noContentSchema } from '@/lib/api-client.ts';
import { membersQueryOptions } from '@/features/members/api/list-members.ts';

/** DELETE /api/orgs/:orgId/members/:userId → 204; 409 `last-admin`. */
export async function removeMember(orgId: string, userId: string): Promise<void> {
  await apiRequest(
    `/orgs/${encodeURIComponent(orgId)}/members/${encodeURIComponent(userId)}`,
    noContentSchema,
    { method: 'DELETE' },
  );
}

export function useRemoveMember(orgId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (userId: string) => removeMember(orgId, userId),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: membersQueryOptions(orgId).queryKey }),
  });
}
