import { useMutation, useQueryClient } from '@tanstack/react-query';
import { meResponseSchema, type MeResponse, type SignInRequest } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';
import { startSession } from '@/lib/session.ts';

/** POST /api/auth/sign-in; a wrong password is an answer (401), not an ended session. */
export function signIn(body: SignInRequest): Promise<MeResponse> {
  return apiRequest('/auth/sign-in', meResponseSchema, {
    method: 'POST',
    body,
    unauthorizedIsAnswer: true,
  });
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (me) => startSession(queryClient, me),
  });
}
