import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { InviteInput } from '../../../../shared/schemas/auth';
import { api } from '../../../lib/api-client';
import { peopleKeys } from './list-people';

export const invitePerson = (input: InviteInput) =>
  api<{ invitation: { email: string; expiresAt: string } }>('/api/admin/people/invitations', { method: 'POST', body: input });

export function useInvitePerson() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: invitePerson, onSuccess: () => qc.invalidateQueries({ queryKey: peopleKeys.all }) });
}
