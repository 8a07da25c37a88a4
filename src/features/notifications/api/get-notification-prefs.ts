import { queryOptions, useQuery } from '@tanstack/react-query';
import type { NotificationKind, NOTIFICATION_MODES } from '../../../../shared/schemas/review';
import { api } from '../../../lib/api-client';
import { notificationKeys } from './notification-keys';

export type NotificationMode = (typeof NOTIFICATION_MODES)[number];
export type FullPrefs = Record<NotificationKind, NotificationMode>;

export const getNotificationPrefs = (signal?: AbortSignal) => api<{ prefs: FullPrefs }>('/api/profile/notifications', { signal });

export const notificationPrefsQueryOptions = () =>
  queryOptions({ queryKey: notificationKeys.prefs(), queryFn: ({ signal }) => getNotificationPrefs(signal) });

export const useNotificationPrefs = () => useQuery(notificationPrefsQueryOptions());
