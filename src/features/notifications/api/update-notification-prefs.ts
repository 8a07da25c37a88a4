import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { NotificationPrefs } from '../../../../shared/schemas/review';
import { api } from '../../../lib/api-client';
import type { FullPrefs } from './get-notification-prefs';
import { notificationKeys } from './notification-keys';

export const updateNotificationPrefs = (prefs: NotificationPrefs) =>
  api<{ prefs: FullPrefs }>('/api/profile/notifications', { method: 'PUT', body: { prefs } });

/** Saves changed kinds; the screen shows the choice at once and rolls back if the server refuses. */
export function useUpdateNotificationPrefs() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: updateNotificationPrefs,
    onMutate: async (change) => {
      await qc.cancelQueries({ queryKey: notificationKeys.prefs() });
      const before = qc.getQueryData<{ prefs: FullPrefs }>(notificationKeys.prefs());
      if (before) qc.setQueryData(notificationKeys.prefs(), { prefs: { ...before.prefs, ...change } });
      return { before };
    },
    onError: (_err, _change, context) => {
      if (context?.before) qc.setQueryData(notificationKeys.prefs(), context.before);
    },
    onSuccess: (data) => qc.setQueryData(notificationKeys.prefs(), data),
  });
}
