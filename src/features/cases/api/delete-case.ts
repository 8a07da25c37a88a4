import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { caseKeys } from './case-keys';

export const deleteCase = (id: number) => api<void>(`/api/cases/${id}`, { method: 'DELETE' });

export function useDeleteCase() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: deleteCase,
    onSuccess: (_v, id) => {
      qc.removeQueries({ queryKey: caseKeys.detail(id) });
      void qc.invalidateQueries({ queryKey: caseKeys.all });
    },
  });
}
