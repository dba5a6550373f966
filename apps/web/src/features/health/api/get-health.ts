import { queryOptions, useQuery } from '@tanstack/react-query';
import { healthResponseSchema, type HealthResponse } from '@biasproof/shared';
import { appConfig } from '@/config/app-config.ts';
import { apiRequest } from '@/lib/api-client.ts';

/** GET /api/health. A 503 still carries a health report (database down), so it is not an error. */
export function getHealth(signal?: AbortSignal): Promise<HealthResponse> {
  return apiRequest('/health', healthResponseSchema, {
    acceptStatuses: [503],
    ...(signal ? { signal } : {}),
  });
}

export function healthQueryOptions() {
  return queryOptions({
    queryKey: ['health'] as const,
    queryFn: ({ signal }) => getHealth(signal),
    refetchInterval: appConfig.healthRefetchIntervalMs,
    meta: { keepAcrossSessions: true },
  });
}

export function useHealth() {
  return useQuery(healthQueryOptions());
}
