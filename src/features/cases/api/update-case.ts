import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Case, CasePatchInput } from '../../../../shared/schemas/case';
import { api } from '../../../lib/api-client';
import { caseKeys } from './case-keys';

/** PATCH with `baseUpdatedAt` (required): a 409 means someone else saved since that version. */
export const updateCase = ({ id, ...patch }: CasePatchInput & { id: number; baseUpdatedAt: string }) =>
  api<{ case: Case }>(`/api/cases/${id}`, { method: 'PATCH', body: patch });

export function useUpdateCase() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: updateCase,
    onSuccess: ({ case: c }) => {
      qc.setQueryData(caseKeys.detail(c.id), { case: c });
      // the editor already holds the fresh case; refresh lists and history, not the page being typed in
      void qc.invalidateQueries({ queryKey: caseKeys.all, predicate: (q) => !(q.queryKey.length === 3 && q.queryKey[1] === 'detail') });
    },
  });
}
