import { useMutation, useQueryClient } from '@tanstack/react-query';
import { notificationPreferencesSchema, type NotificationPreferences } from '@biasproof/shared';
import { apiRequest } from '@/lib/api-client.ts';
import { notificationPreferencesQueryOptions } from '@/features/profile/api/get-notification-preferences.ts';

/** PUT /api/account/notifications → the stored preferences. */
export function updateNotificationPreferences(
  body: NotificationPreferences,
): Promise<NotificationPreferences> {
  return apiRequest('/account/notifications', notificationPreferencesSchema, {
    method: 'PUT',
    body,
  });
}

export function useUpdateNotificationPreferences() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateNotificationPreferences,
    onSuccess: (saved) =>
      queryClient.setQueryData(notificationPreferencesQueryOptions().queryKey, saved),
  });
}
