import { useMutation, useQueryClient } from '@tanstack/react-query';
import { worksheetSchema, type UpdateWorksheetRequest, type Worksheet } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';
import { allWorksheetListsKey } from '@/features/worksheets/api/list-worksheets.ts';
import { worksheetQueryOptions } from '@/features/worksheets/api/get-worksheet.ts';

/**
 * PATCH /api/orgs/:orgId/worksheets/:id with the `version` last read. A stale version answers
 * 409 `stale-version` with the current one in `fields.version`; a new circuit or settings are
 * computed on the server in the same request, so the answer carries their stored results.
 */
export function updateWorksheet(
  orgId: string,
  worksheetId: string,
  body: UpdateWorksheetRequest,
): Promise<Worksheet> {
  return apiRequest(
    `/orgs/${encodeURIComponent(orgId)}/worksheets/${encodeURIComponent(worksheetId)}`,
    worksheetSchema,
    { method: 'PATCH', body },
  );
}

export function useUpdateWorksheet(orgId: string, worksheetId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdateWorksheetRequest) => updateWorksheet(orgId, worksheetId, body),
    onSuccess: async (worksheet) => {
      queryClient.setQueryData(worksheetQueryOptions(orgId, worksheetId).queryKey, worksheet);
      await queryClient.invalidateQueries({ queryKey: allWorksheetListsKey(orgId) });
    },
  });
}
