import { useMutation, useQueryClient } from '@tanstack/react-query';
import {
  apiErrorBodySchema,
  attachmentSchema,
  csrfResponseSchema,
  type Attachment,
} from '@biasproof/shared';
import { ApiError, apiRequest } from '@/lib/api-client.ts';
import { appConfig } from '@/config/app-config.ts';
import { worksheetApiPath, worksheetReviewKey } from '@/features/review/api/review-key.ts';

async function postForm(path: string, form: FormData): Promise<Response> {
  // The token is fetched the way apiRequest gets it; the server keeps one per session.
  const { token } = await apiRequest('/auth/csrf', csrfResponseSchema);
  try {
    return await fetch(`${appConfig.apiBasePath}${path}`, {
      method: 'POST',
      credentials: 'same-origin',
      headers: { Accept: 'application/json', 'x-csrf-token': token },
      body: form,
    });
  } catch (cause) {
    throw new ApiError({
      status: 0,
      code: 'network_error',
      message: 'The server could not be reached.',
      cause,
    });
  }
}

/**
 * POST …/worksheets/:id/attachments as multipart (`file`, optional `findingId`): the server
 * types the file by its content and refuses anything but PDF, PNG, JPEG, CSV and decks, and
 * anything over 20 MB. (apiRequest sends JSON only, hence this one fetch of its own.)
 */
export async function uploadAttachment(
  orgId: string,
  worksheetId: string,
  file: File,
  findingId?: string,
): Promise<Attachment> {
  const form = new FormData();
  if (findingId) form.append('findingId', findingId);
  form.append('file', file, file.name);
  const response = await postForm(`${worksheetApiPath(orgId, worksheetId)}/attachments`, form);
  const payload: unknown = await response.json().catch(() => undefined);
  if (!response.ok) {
    const parsed = apiErrorBodySchema.safeParse(payload);
    if (parsed.success) {
      const { code, message, fields } = parsed.data.error;
      throw new ApiError({
        status: response.status,
        code,
        message,
        ...(fields ? { fields } : {}),
      });
    }
    throw new ApiError({
      status: response.status,
      code: 'http_error',
      message:
        response.status === 413
          ? `${file.name} is larger than the server takes.`
          : `The upload failed: ${response.status} ${response.statusText}`.trim(),
    });
  }
  const parsed = attachmentSchema.safeParse(payload);
  if (!parsed.success) {
    throw new ApiError({
      status: response.status,
      code: 'unexpected_response',
      message: 'Unexpected answer to the upload.',
      cause: parsed.error,
    });
  }
  return parsed.data;
}

export function useUploadAttachment(orgId: string, worksheetId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ file, findingId }: { file: File; findingId?: string | undefined }) =>
      uploadAttachment(orgId, worksheetId, file, findingId),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: worksheetReviewKey(orgId, worksheetId) }),
  });
}
