import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { LessonBook } from '../../../../shared/schemas/lessons';
import { lessonKeys, storeLessonBook } from './get-lessons';

export const pinLesson = ({ caseId, pinned }: { caseId: number; pinned: boolean }) =>
  api<LessonBook>(`/api/lessons/${caseId}/pin`, { method: 'POST', body: { pinned } });

// Pins in flight together may be answered in any order, and each answer is the book as it stood
// then: the last answer to arrive is not always the newest book, so after an overlap the page asks again.
let pinsInFlight = 0;
let overlapped = false;

/** Pins or unpins a lesson on the bench checklist; the answer is the unfiltered book, searches refetch. */
export function usePinLesson() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: pinLesson,
    onMutate: () => {
      if (pinsInFlight++ > 0) overlapped = true;
    },
    onSuccess: (book) => storeLessonBook(qc, book),
    onSettled: () => {
      if (--pinsInFlight > 0 || !overlapped) return;
      overlapped = false;
      void qc.invalidateQueries({ queryKey: lessonKeys.all });
    },
  });
}
