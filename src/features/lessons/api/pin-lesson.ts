import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { LessonBook } from '../../../../shared/schemas/lessons';
import { storeLessonBook } from './get-lessons';

export const pinLesson = ({ caseId, pinned }: { caseId: number; pinned: boolean }) =>
  api<LessonBook>(`/api/lessons/${caseId}/pin`, { method: 'POST', body: { pinned } });

/** Pins or unpins a lesson on the bench checklist; the answer is the unfiltered book, searches refetch. */
export function usePinLesson() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: pinLesson,
    onSuccess: (book) => storeLessonBook(qc, book),
  });
}
