import { queryOptions, useQuery, type QueryClient } from '@tanstack/react-query';
import type { User } from '../../../../shared/schemas/auth';
import { api } from '../../../lib/api-client';

export const authKeys = { all: ['auth'] as const, me: () => ['auth', 'me'] as const };

interface MeData {
  user: User | null;
  /** Mails go to the local fake (no SMTP_URL), so the Outbox screen exists. */
  localMail?: boolean;
}

export const getMe = () => api<MeData>('/api/auth/me', { quiet401: true });

/** Records who is signed in now; what only /api/auth/me knows is taken from the answer, kept, or fetched when it is missing. */
export function setMe(qc: QueryClient, user: User | null, localMail?: boolean) {
  const next = qc.setQueryData<MeData>(authKeys.me(), (old) => ({ ...old, user, ...(localMail === undefined ? {} : { localMail }) }));
  if (next?.localMail === undefined && user) void qc.invalidateQueries({ queryKey: authKeys.me() });
}

export const meQueryOptions = () => queryOptions({ queryKey: authKeys.me(), queryFn: getMe, staleTime: 5 * 60_000 });

/** The signed-in user, `null` when signed out, `undefined` while loading. */
export function useMe() {
  const q = useQuery(meQueryOptions());
  return { ...q, user: q.data?.user, localMail: q.data?.localMail ?? false };
}
