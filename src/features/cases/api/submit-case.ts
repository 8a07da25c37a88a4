import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Case } from '../../../../shared/schemas/case';
import { api } from '../../../lib/api-client';
import { caseKeys } from './case-keys';

/** Sends a draft (or a sent-back case) to the review desk; 400 lists what is still missing. */
export const submitCase = (id: number) => api<{ case: Case }>(`/api/cases/${id}/submit`, { method: 'POST' });

export function useSubmitCase() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: submitCase,
    onSuccess: ({ case: c }) => {
      qc.setQueryData(caseKeys.detail(c.id), { case: c });
      void qc.invalidateQueries({ queryKey: caseKeys.all });
    },
  });
}
