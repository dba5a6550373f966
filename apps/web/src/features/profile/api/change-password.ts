import { useMutation } from '@tanstack/react-query';
import type { z } from 'zod';
import type { changePasswordRequestSchema } from '@biasproof/shared';
import { apiRequest, noContentSchema } from '@/lib/api-client.ts';

export type ChangePasswordRequest = z.output<typeof changePasswordRequestSchema>;

/** POST /api/auth/me/password → 204; the server ends the person's other sessions. */
export async function changePassword(body: ChangePasswordRequest): Promise<void> {
  await apiRequest('/auth/me/password', noContentSchema, { method: 'POST', body });
}

export function useChangePassword() {
  return useMutation({ mutationFn: changePassword });
}
