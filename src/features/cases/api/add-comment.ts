import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Comment } from '../../../../shared/schemas/case';
import { api } from '../../../lib/api-client';
import { caseKeys } from './case-keys';

export const addComment = ({ caseId, body }: { caseId: number; body: string }) =>
  api<{ comment: Comment }>(`/api/cases/${caseId}/comments`, { method: 'POST', body: { body } });

export function useAddComment(caseId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: (body: string) => addComment({ caseId, body }), onSettled: () => qc.invalidateQueries({ queryKey: caseKeys.comments(caseId) }) });
}
