import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import {
  invitationSchema,
  type createInvitationRequestSchema,
  type Invitation,
} from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';
import { invalidateInvitationLists } from '@/features/members/api/list-invitations.ts';

export type CreateInvitationValues = z.output<typeof createInvitationRequestSchema>;

/** POST /api/orgs/:orgId/invitations → 201; 409 when already a member or already invited. */
export function createInvitation(orgId: string, body: CreateInvitationValues): Promise<Invitation> {
  return apiRequest(`/orgs/${encodeURIComponent(orgId)}/invitations`, invitationSchema, {
    method: 'POST',
    body,
  });
}

export function useCreateInvitation(orgId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateInvitationValues) => createInvitation(orgId, body),
    onSuccess: () => invalidateInvitationLists(queryClient, orgId),
  });
}
