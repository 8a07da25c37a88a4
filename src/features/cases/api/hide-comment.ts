import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Comment } from '../../../../shared/schemas/case';
import { api } from '../../../lib/api-client';
import { caseKeys } from './case-keys';

/** Moderators hide (or show again) a comment; others then see only that it was hidden. */
export const hideComment = ({ commentId, hidden }: { commentId: number; hidden: boolean }) =>
  api<{ comment: Comment }>(`/api/comments/${commentId}/hide`, { method: 'POST', body: { hidden } });

export function useHideComment(caseId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: hideComment, onSettled: () => qc.invalidateQueries({ queryKey: caseKeys.comments(caseId) }) });
}
