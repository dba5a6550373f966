import { queryOptions, useQuery } from '@tanstack/react-query';
import type { z } from 'zod';
import { invitationPreviewSchema } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';

export type InvitationPreview = z.infer<typeof invitationPreviewSchema>;

/** GET /api/invitations/:token (public): what the invitee is asked to join. */
export function getInvitationPreview(
  token: string,
  signal?: AbortSignal,
): Promise<InvitationPreview> {
  return apiRequest(`/invitations/${encodeURIComponent(token)}`, invitationPreviewSchema, {
    unauthorizedIsAnswer: true,
    ...(signal ? { signal } : {}),
  });
}

export function invitationPreviewQueryOptions(token: string) {
  return queryOptions({
    queryKey: ['invitations', 'preview', token] as const,
    queryFn: ({ signal }) => getInvitationPreview(token, signal),
  });
}

export function useInvitationPreview(token: string) {
  return useQuery(invitationPreviewQueryOptions(token));
}
