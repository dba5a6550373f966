import { useMutation, useQueryClient } from '@tanstack/react-query';
import { projectSchema, type Project, type UpdateProjectRequest } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';
import { allProjectListsKey } from '@/lib/api/list-projects.ts';

/** PATCH /api/orgs/:orgId/projects/:id: rename, re-code, archive (`archived: true`) or restore. */
export function updateProject(
  orgId: string,
  projectId: string,
  body: UpdateProjectRequest,
): Promise<Project> {
  return apiRequest(
    `/orgs/${encodeURIComponent(orgId)}/projects/${encodeURIComponent(projectId)}`,
    projectSchema,
    { method: 'PATCH', body },
  );
}

export function useUpdateProject(orgId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ projectId, ...body }: UpdateProjectRequest & { projectId: string }) =>
      updateProject(orgId, projectId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: allProjectListsKey(orgId) }),
  });
}
