import { useMutation } from '@tanstack/react-query';
import type { ResetConfirmInput } from '../../../../shared/schemas/auth';
import { api } from '../../../lib/api-client';

export const confirmReset = (input: ResetConfirmInput) =>
  api<{ ok: true }>('/api/auth/password-reset/confirm', { method: 'POST', body: input });

export const useConfirmReset = () => useMutation({ mutationFn: confirmReset });
