import { queryOptions, useQuery } from '@tanstack/react-query';
import {
  listResponseSchema,
  modelLibraryEntrySchema,
  type ModelListQuery,
} from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';
import { toQueryString } from '@/lib/api/query-string.ts';

const modelListSchema = listResponseSchema(modelLibraryEntrySchema);

/** GET /api/orgs/:orgId/models: the organization's model library, ordered by name. */
export function listModels(orgId: string, query: ModelListQuery, signal?: AbortSignal) {
  return apiRequest(
    `/orgs/${encodeURIComponent(orgId)}/models${toQueryString(query)}`,
    modelListSchema,
    signal ? { signal } : {},
  );
}

export function modelLibraryQueryOptions(orgId: string, query: ModelListQuery = {}) {
  return queryOptions({
    queryKey: ['orgs', orgId, 'models', query] as const,
    queryFn: ({ signal }) => listModels(orgId, query, signal),
    staleTime: 60_000,
  });
}

export function useModelLibrary(orgId: string, query: ModelListQuery = {}) {
  return useQuery(modelLibraryQueryOptions(orgId, query));
}
