import { useMutation, useQueryClient } from '@tanstack/react-query';
import { projectSchema, type CreateProjectRequest, type Project } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';
import { allProjectListsKey } from '@/lib/api/list-projects.ts';

/** POST /api/orgs/:orgId/projects: 409 when the code is taken, 400 with `fields` on bad input. */
export function createProject(orgId: string, body: CreateProjectRequest): Promise<Project> {
  return apiRequest(`/orgs/${encodeURIComponent(orgId)}/projects`, projectSchema, {
    method: 'POST',
    body,
  });
}

export function useCreateProject(orgId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateProjectRequest) => createProject(orgId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: allProjectListsKey(orgId) }),
  });
}
