import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Case, CaseCreateInput } from '../../../../shared/schemas/case';
import { api } from '../../../lib/api-client';
import { caseKeys } from './case-keys';

export const createCase = (input: CaseCreateInput) => api<{ case: Case }>('/api/cases', { method: 'POST', body: input });

export function useCreateCase() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: createCase,
    onSuccess: ({ case: c }) => {
      qc.setQueryData(caseKeys.detail(c.id), { case: c });
      void qc.invalidateQueries({ queryKey: caseKeys.lists() });
    },
  });
}
