import { queryOptions, useQuery, type QueryClient } from '@tanstack/react-query';
import { invitationSchema, listResponseSchema } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';

const invitationsListSchema = listResponseSchema(invitationSchema);

export type InvitationStatusFilter = 'pending' | 'all';

/** GET /api/orgs/:orgId/invitations?status=… (admin) → `{items,total}`. */
export function listInvitations(
  orgId: string,
  status: InvitationStatusFilter,
  signal?: AbortSignal,
) {
  return apiRequest(
    `/orgs/${encodeURIComponent(orgId)}/invitations?status=${status}`,
    invitationsListSchema,
    { ...(signal ? { signal } : {}) },
  );
}

export function invitationsQueryOptions(orgId: string, status: InvitationStatusFilter = 'pending') {
  return queryOptions({
    queryKey: ['orgs', orgId, 'invitations', { status }] as const,
    queryFn: ({ signal }) => listInvitations(orgId, status, signal),
  });
}

export function useInvitations(orgId: string, status: InvitationStatusFilter = 'pending') {
  return useQuery(invitationsQueryOptions(orgId, status));
}

/** After any change to invitations, every filtered list of them is out of date. */
export async function invalidateInvitationLists(queryClient: QueryClient, orgId: string) {
  const statuses: InvitationStatusFilter[] = ['pending', 'all'];
  await Promise.all(
    statuses.map((status) =>
      queryClient.invalidateQueries({ queryKey: invitationsQueryOptions(orgId, status).queryKey }),
    ),
  );
}
