import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { caseKeys } from './case-keys';

export const deleteComment = (commentId: number) => api<void>(`/api/comments/${commentId}`, { method: 'DELETE' });

export function useDeleteComment(caseId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deleteComment, onSettled: () => qc.invalidateQueries({ queryKey: caseKeys.comments(caseId) }) });
}
