import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { notificationKeys } from './notification-keys';

export interface Watches {
  cases: number[];
  tags: string[];
}

export const getWatches = (signal?: AbortSignal) => api<Watches>('/api/profile/watches', { signal });

export const watchesQueryOptions = () => queryOptions({ queryKey: notificationKeys.watches(), queryFn: ({ signal }) => getWatches(signal) });

export const useWatches = () => useQuery(watchesQueryOptions());
