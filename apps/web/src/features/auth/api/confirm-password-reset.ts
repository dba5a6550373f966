import { useMutation } from '@tanstack/react-query';
import type { z } from 'zod';
import type { passwordResetConfirmSchema } from '@biasproof/shared';
import { apiRequest, noContentSchema } from '@/lib/api-client.ts';

export type PasswordResetConfirm = z.output<typeof passwordResetConfirmSchema>;

/** POST /api/auth/password-reset/confirm → 204; the token works once, for one hour. */
export async function confirmPasswordReset(body: PasswordResetConfirm): Promise<void> {
  await apiRequest('/auth/password-reset/confirm', noContentSchema, { method: 'POST', body });
}

export function useConfirmPasswordReset() {
  return useMutation({ mutationFn: confirmPasswordReset });
}
