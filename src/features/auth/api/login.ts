import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LoginInput, User } from '../../../../shared/schemas/auth';
import { api, resetCsrfToken } from '../../../lib/api-client';
import { setMe } from './get-me';

export const login = (input: LoginInput) => api<{ user: User; localMail?: boolean }>('/api/auth/login', { method: 'POST', body: input, quiet401: true });

export function useLogin() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: login,
    onSuccess: ({ user, localMail }) => {
      resetCsrfToken();
      qc.clear();
      setMe(qc, user, localMail);
    },
  });
}
