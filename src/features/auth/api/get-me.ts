import { queryOptions, useQuery } from '@tanstack/react-query';
import type { User } from '../../../../shared/schemas/auth';
import { api } from '../../../lib/api-client';

export const authKeys = { all: ['auth'] as const, me: () => ['auth', 'me'] as const };

export const getMe = () => api<{ user: User | null }>('/api/auth/me', { quiet401: true });

export const meQueryOptions = () => queryOptions({ queryKey: authKeys.me(), queryFn: getMe, staleTime: 5 * 60_000 });

/** The signed-in user, `null` when signed out, `undefined` while loading. */
export function useMe() {
  const q = useQuery(meQueryOptions());
  return { ...q, user: q.data?.user };
}
