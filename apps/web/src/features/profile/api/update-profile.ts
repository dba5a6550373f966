import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import {
  meResponseSchema,
  type MeResponse,
  type updateProfileRequestSchema,
} from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';
import { meQueryOptions } from '@/lib/session.ts';

export type UpdateProfileRequest = z.output<typeof updateProfileRequestSchema>;

/** PATCH /api/auth/me → the updated `me`. */
export function updateProfile(body: UpdateProfileRequest): Promise<MeResponse> {
  return apiRequest('/auth/me', meResponseSchema, { method: 'PATCH', body });
}

export function useUpdateProfile() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateProfile,
    onSuccess: (me) => queryClient.setQueryData(meQueryOptions().queryKey, me),
  });
}
