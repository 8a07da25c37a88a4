import { useMutation } from '@tanstack/react-query';
import type { ResetRequestInput } from '../../../../shared/schemas/auth';
import { api } from '../../../lib/api-client';

export const requestReset = (input: ResetRequestInput) =>
  api<{ ok: true; message: string }>('/api/auth/password-reset', { method: 'POST', body: input });

export const useRequestReset = () => useMutation({ mutationFn: requestReset });
