import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ProfileInput, User } from '../../../../shared/schemas/auth';
import { api } from '../../../lib/api-client';
import { setMe } from './get-me';

export const updateProfile = (input: ProfileInput) => api<{ user: User }>('/api/profile', { method: 'PATCH', body: input });

export function useUpdateProfile() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updateProfile, onSuccess: ({ user }) => setMe(qc, user) });
}
