import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ChecklistOrder, LessonBook } from '../../../../shared/schemas/lessons';
import { lessonKeys, storeLessonBook } from './get-lessons';

export const reorderChecklist = (order: ChecklistOrder) => api<LessonBook>('/api/lessons/checklist', { method: 'PUT', body: order });

/** Sends the bench checklist's new order (moderators); a refused order refetches the current one. */
export function useReorderChecklist() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: reorderChecklist,
    onSuccess: (book) => storeLessonBook(qc, book),
    onError: () => qc.invalidateQueries({ queryKey: lessonKeys.all }),
  });
}
