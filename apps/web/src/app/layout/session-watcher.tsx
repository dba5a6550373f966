import { useQueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';
import { onUnauthorized } from '@/lib/api-client.ts';
import { endSession } from '@/lib/session.ts';

/**
 * A 401 from any request means the session is gone (expired, signed out elsewhere): forget it
 * here too; the sign-in guard then sends the person to sign in and back.
 */
export function SessionWatcher() {
  const queryClient = useQueryClient();
  useEffect(() => onUnauthorized(() => endSession(queryClient)), [queryClient]);
  return null;
}
