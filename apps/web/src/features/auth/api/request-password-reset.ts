import { useMutation } from '@tanstack/react-query';
import type { z } from 'zod';
import type { passwordResetRequestSchema } from '@biasproof/shared';
import { apiRequest, noContentSchema } from '@/lib/api-client.ts';

export type PasswordResetRequest = z.output<typeof passwordResetRequestSchema>;

/** POST /api/auth/password-reset → 202, the same whether or not the address has an account. */
export async function requestPasswordReset(body: PasswordResetRequest): Promise<void> {
  await apiRequest('/auth/password-reset', noContentSchema, { method: 'POST', body });
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
