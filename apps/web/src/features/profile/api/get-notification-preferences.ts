import { queryOptions, useQuery } from '@tanstack/react-query';
import { notificationPreferencesSchema } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';

/** GET /api/account/notifications: workflow e-mail at once or as a daily digest. */
export function getNotificationPreferences(signal?: AbortSignal) {
  return apiRequest(
    '/account/notifications',
    notificationPreferencesSchema,
    signal ? { signal } : {},
  );
}

export function notificationPreferencesQueryOptions() {
  return queryOptions({
    queryKey: ['account', 'notifications'] as const,
    queryFn: ({ signal }) => getNotificationPreferences(signal),
  });
}

export function useNotificationPreferences() {
  return useQuery(notificationPreferencesQueryOptions());
}
