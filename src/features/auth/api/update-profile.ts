import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ProfileInput, User } from '../../../../shared/schemas/auth';
import { api } from '../../../lib/api-client';
import { authKeys } from './get-me';

export const updateProfile = (input: ProfileInput) => api<{ user: User }>('/api/profile', { method: 'PATCH', body: input });

export function useUpdateProfile() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updateProfile, onSuccess: ({ user }) => qc.setQueryData(authKeys.me(), { user }) });
}
