import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Comment } from '../../../../shared/schemas/case';
import { api } from '../../../lib/api-client';
import { caseKeys } from './case-keys';

export const editComment = ({ commentId, body }: { commentId: number; body: string }) =>
  api<{ comment: Comment }>(`/api/comments/${commentId}`, { method: 'PATCH', body: { body } });

export function useEditComment(caseId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: editComment, onSettled: () => qc.invalidateQueries({ queryKey: caseKeys.comments(caseId) }) });
}
