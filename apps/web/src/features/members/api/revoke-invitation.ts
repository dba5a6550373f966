import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest, noContentSchema } from '@/lib/api-client.ts';
import { invalidateInvitationLists } from '@/features/members/api/list-invitations.ts';

/** DELETE /api/orgs/:orgId/invitations/:id → 204; the link stops working. */
export async function revokeInvitation(orgId: string, invitationId: string): Promise<void> {
  await apiRequest(
    `/orgs/${encodeURIComponent(orgId)}/invitations/${encodeURIComponent(invitationId)}`,
    noContentSchema,
    { method: 'DELETE' },
  );
}

export function useRevokeInvitation(orgId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (invitationId: string) => revokeInvitation(orgId, invitationId),
    onSuccess: () => invalidateInvitationLists(queryClient, orgId),
  });
}
