import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, resetCsrfToken } from '../../../lib/api-client';
import { setMe } from './get-me';

export const logout = () => api<{ ok: true }>('/api/auth/logout', { method: 'POST', quiet401: true });

export function useLogout() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: logout,
    onSettled: () => {
      resetCsrfToken();
      qc.clear();
      setMe(qc, null);
    },
  });
}
