import { queryOptions, useQuery } from '@tanstack/react-query';
import { auditVerifyResponseSchema } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';

/** GET /api/orgs/:orgId/audit/verify (manager): whether the hash chain is intact. */
export function verifyAuditChain(orgId: string, signal?: AbortSignal) {
  return apiRequest(
    `/orgs/${encodeURIComponent(orgId)}/audit/verify`,
    auditVerifyResponseSchema,
    signal ? { signal } : {},
  );
}

export function auditChainQueryOptions(orgId: string) {
  return queryOptions({
    queryKey: ['orgs', orgId, 'audit', 'verify'] as const,
    queryFn: ({ signal }) => verifyAuditChain(orgId, signal),
  });
}

export function useAuditChain(orgId: string, enabled: boolean) {
  return useQuery({ ...auditChainQueryOptions(orgId), enabled });
}
