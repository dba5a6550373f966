import { useMutation, useQueryClient } from '@tanstack/react-query';
import { invitationSchema, type Invitation } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';
import { invalidateInvitationLists } from '@/features/members/api/list-invitations.ts';

/** POST /api/orgs/:orgId/invitations/:id/resend: new link, new 7-day expiry, new e-mail. */
export function resendInvitation(orgId: string, invitationId: string): Promise<Invitation> {
  return apiRequest(
    `/orgs/${encodeURIComponent(orgId)}/invitations/${encodeURIComponent(invitationId)}/resend`,
    invitationSchema,
    { method: 'POST' },
  );
}

export function useResendInvitation(orgId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (invitationId: string) => resendInvitation(orgId, invitationId),
    onSuccess: () => invalidateInvitationLists(queryClient, orgId),
  });
}
