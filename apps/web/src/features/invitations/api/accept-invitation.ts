import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import {
  meResponseSchema,
  type acceptInvitationRequestSchema,
  type MeResponse,
} from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';
import { startSession } from '@/lib/session.ts';

export type AcceptInvitationRequest = z.input<typeof acceptInvitationRequestSchema>;

/**
 * POST /api/invitations/:token/accept. A new person sends name and password and is signed in;
 * a person signed in with the invited address sends `{}` and joins with that account.
 */
export function acceptInvitation(
  token: string,
  body: AcceptInvitationRequest,
): Promise<MeResponse> {
  return apiRequest(`/invitations/${encodeURIComponent(token)}/accept`, meResponseSchema, {
    method: 'POST',
    body,
  });
}

export function useAcceptInvitation(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: AcceptInvitationRequest) => acceptInvitation(token, body),
    onSuccess: (me) => startSession(queryClient, me),
  });
}
