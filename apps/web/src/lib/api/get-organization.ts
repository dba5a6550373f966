import { queryOptions, useQuery } from '@tanstack/react-query';
import { organizationSchema } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';

// Shared by the review (signature times) and the audit log (event times): both show dates in
// the organization's time zone, and features do not import each other.

/** GET /api/orgs/:orgId: name, slug and the IANA time zone dates are shown in. */
export function getOrganization(orgId: string, signal?: AbortSignal) {
  return apiRequest(
    `/orgs/${encodeURIComponent(orgId)}`,
    organizationSchema,
    signal ? { signal } : {},
  );
}

export function organizationQueryOptions(orgId: string) {
  return queryOptions({
    queryKey: ['orgs', orgId, 'organization'] as const,
    queryFn: ({ signal }) => getOrganization(orgId, signal),
    staleTime: 5 * 60_000,
  });
}

export function useOrganization(orgId: string) {
  return useQuery(organizationQueryOptions(orgId));
}
