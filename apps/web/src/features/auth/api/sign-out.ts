import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router-dom';
import { apiRequest, noContentSchema } from '@/lib/api-client.ts';
import { endSession } from '@/lib/session.ts';

/** POST /api/auth/sign-out → 204; the server destroys the stored session. */
export async function signOut(): Promise<void> {
  await apiRequest('/auth/sign-out', noContentSchema, {
    method: 'POST',
    unauthorizedIsAnswer: true,
  });
}

/** Signs out, then shows the sign-in page; whatever the server answered, this browser forgets the session. */
export function useSignOut() {
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  return useMutation({
    mutationFn: signOut,
    // Leave the signed-in page first (rendered at once, not in a transition): ending the
    // session while it shows would make its guard send the person to sign in and back to it.
    onSettled: async () => {
      await navigate('/sign-in', { replace: true, flushSync: true });
      endSession(queryClient);
    },
  });
}
