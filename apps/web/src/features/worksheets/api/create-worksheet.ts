import { useMutation, useQueryClient } from '@tanstack/react-query';
import { worksheetSchema, type CreateWorksheetRequest, type Worksheet } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';
import { allProjectListsKey } from '@/lib/api/list-projects.ts';
import { allWorksheetListsKey } from '@/features/worksheets/api/list-worksheets.ts';
import { worksheetQueryOptions } from '@/features/worksheets/api/get-worksheet.ts';

/** POST /api/orgs/:orgId/worksheets: a draft at revision A, computed on the server at once. */
export function createWorksheet(orgId: string, body: CreateWorksheetRequest): Promise<Worksheet> {
  return apiRequest(`/orgs/${encodeURIComponent(orgId)}/worksheets`, worksheetSchema, {
    method: 'POST',
    body,
  });
}

export function useCreateWorksheet(orgId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateWorksheetRequest) => createWorksheet(orgId, body),
    onSuccess: async (worksheet) => {
      queryClient.setQueryData(worksheetQueryOptions(orgId, worksheet.id).queryKey, worksheet);
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: allWorksheetListsKey(orgId) }),
        // Projects show how many worksheets they hold.
        queryClient.invalidateQueries({ queryKey: allProjectListsKey(orgId) }),
      ]);
    },
  });
}
