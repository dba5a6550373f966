import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { memberSchema, type Member, type updateMemberRequestSchema } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';
import { membersQueryOptions } from '@/features/members/api/list-members.ts';

export type UpdateMemberRequest = z.output<typeof updateMemberRequestSchema>;

/** PATCH /api/orgs/:orgId/members/:userId: new roles and/or disabled; 409 `last-admin`. */
export function updateMember(
  orgId: string,
  userId: string,
  body: UpdateMemberRequest,
): Promise<Member> {
  return apiRequest(
    `/orgs/${encodeURIComponent(orgId)}/members/${encodeURIComponent(userId)}`,
    memberSchema,
    { method: 'PATCH', body },
  );
}

export function useUpdateMember(orgId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, ...body }: UpdateMemberRequest & { userId: string }) =>
      updateMember(orgId, userId, body),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: membersQueryOptions(orgId).queryKey }),
  });
}
