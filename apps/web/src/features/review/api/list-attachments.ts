import { queryOptions, useQuery } from '@tanstack/react-query';
import { attachmentListSchema } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';
import { appConfig } from '@/config/app-config.ts';
import { worksheetApiPath, worksheetReviewKey } from '@/features/review/api/review-key.ts';

/** GET …/worksheets/:id/attachments: the worksheet's files and its findings' files. */
export function listAttachments(orgId: string, worksheetId: string, signal?: AbortSignal) {
  return apiRequest(
    `${worksheetApiPath(orgId, worksheetId)}/attachments`,
    attachmentListSchema,
    signal ? { signal } : {},
  );
}

export function attachmentsQueryOptions(orgId: string, worksheetId: string) {
  return queryOptions({
    queryKey: [...worksheetReviewKey(orgId, worksheetId), 'attachments'] as const,
    queryFn: ({ signal }) => listAttachments(orgId, worksheetId, signal),
  });
}

export function useAttachments(orgId: string, worksheetId: string) {
  return useQuery(attachmentsQueryOptions(orgId, worksheetId));
}

/** Where the browser downloads one attachment (served with `Content-Disposition: attachment`). */
export function attachmentDownloadUrl(orgId: string, attachmentId: string): string {
  return `${appConfig.apiBasePath}/orgs/${encodeURIComponent(orgId)}/attachments/${encodeURIComponent(attachmentId)}`;
}
