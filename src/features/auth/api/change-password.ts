import { useMutation } from '@tanstack/react-query';
import type { ChangePasswordInput } from '../../../../shared/schemas/auth';
import { api } from '../../../lib/api-client';

export const changePassword = (input: ChangePasswordInput) =>
  api<{ ok: true }>('/api/profile/password', { method: 'POST', body: input });

export const useChangePassword = () => useMutation({ mutationFn: changePassword });
