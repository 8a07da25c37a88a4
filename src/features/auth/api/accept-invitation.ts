import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AcceptInvitationInput, User } from '../../../../shared/schemas/auth';
import { api, resetCsrfToken } from '../../../lib/api-client';
import { setMe } from './get-me';

export const acceptInvitation = (input: AcceptInvitationInput) =>
  api<{ user: User; localMail?: boolean }>('/api/auth/invitations/accept', { method: 'POST', body: input });

export function useAcceptInvitation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: acceptInvitation,
    onSuccess: ({ user, localMail }) => {
      resetCsrfToken();
      setMe(qc, user, localMail);
    },
  });
}
