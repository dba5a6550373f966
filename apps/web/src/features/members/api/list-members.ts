import { queryOptions, useQuery } from '@tanstack/react-query';
import { listResponseSchema, memberSchema } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';

const membersListSchema = listResponseSchema(memberSchema);

/** GET /api/orgs/:orgId/members → `{items,total}` of the organization's members. */
export function listMembers(orgId: string, signal?: AbortSignal) {
  return apiRequest(`/orgs/${encodeURIComponent(orgId)}/members`, membersListSchema, {
    ...(signal ? { signal } : {}),
  });
}

export function membersQueryOptions(orgId: string) {
  return queryOptions({
    queryKey: ['orgs', orgId, 'members'] as const,
    queryFn: ({ signal }) => listMembers(orgId, signal),
  });
}

export function useMembers(orgId: string) {
  return useQuery(membersQueryOptions(orgId));
}
