import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Case } from '../../../../shared/schemas/case';
import type { ReviewInput } from '../../../../shared/schemas/review';
import { api } from '../../../lib/api-client';
import { reviewKeys } from './review-keys';

export const reviewCase = ({ caseId, ...input }: ReviewInput & { caseId: number }) =>
  api<{ case: Case }>(`/api/cases/${caseId}/review`, { method: 'POST', body: input });

/** A moderator's decision; the case leaves the queue, and lists, pages and lessons that show it refresh. */
export function useReviewCase() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: reviewCase,
    onSuccess: () =>
      Promise.all([
        qc.invalidateQueries({ queryKey: reviewKeys.all }),
        qc.invalidateQueries({ queryKey: ['cases'] }),
        qc.invalidateQueries({ queryKey: ['lessons'] }),
      ]),
  });
}
