import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { listResponseSchema, projectSchema, type ProjectListQuery } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';
import { toQueryString } from '@/lib/api/query-string.ts';

// Shared by the projects page and the worksheet lists (project filter, "New worksheet"):
// features do not import each other, so this one endpoint lives here.

const projectListSchema = listResponseSchema(projectSchema);

/** Every cached project list of the organization, whatever its query (for invalidation). */
export function allProjectListsKey(orgId: string) {
  return ['orgs', orgId, 'projects'] as const;
}

/** GET /api/orgs/:orgId/projects → `{items,total}` (active ones unless `archived` says otherwise). */
export function listProjects(orgId: string, query: ProjectListQuery, signal?: AbortSignal) {
  return apiRequest(
    `/orgs/${encodeURIComponent(orgId)}/projects${toQueryString(query)}`,
    projectListSchema,
    signal ? { signal } : {},
  );
}

export function projectsQueryOptions(orgId: string, query: ProjectListQuery = {}) {
  return queryOptions({
    queryKey: [...allProjectListsKey(orgId), query] as const,
    queryFn: ({ signal }) => listProjects(orgId, query, signal),
    placeholderData: keepPreviousData,
  });
}

export function useProjects(orgId: string, query: ProjectListQuery = {}) {
  return useQuery(projectsQueryOptions(orgId, query));
}
