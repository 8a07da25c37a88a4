import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Role } from '../../../../shared/auth/roles';
import { api } from '../../../lib/api-client';
import { authKeys } from './get-me';

export const getInvitation = (token: string) =>
  api<{ invitation: { email: string; role: Role } }>(`/api/auth/invitations/${encodeURIComponent(token)}`);

export const invitationQueryOptions = (token: string) =>
  queryOptions({ queryKey: [...authKeys.all, 'invitation', token], queryFn: () => getInvitation(token), retry: false });

export const useInvitation = (token: string) => useQuery(invitationQueryOptions(token));
