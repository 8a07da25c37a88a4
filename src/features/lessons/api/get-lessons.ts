import { keepPreviousData, queryOptions, useQuery, type QueryClient } from '@tanstack/react-query';
import type { LessonBook } from '../../../../shared/schemas/lessons';
import { api } from '../../../lib/api-client';

export const lessonKeys = {
  all: ['lessons'] as const,
  list: (q: string) => ['lessons', 'list', q] as const,
};

export const getLessons = (q: string, signal?: AbortSignal) => api<LessonBook>(`/api/lessons${q ? `?${new URLSearchParams({ q })}` : ''}`, { signal });

export const lessonsQueryOptions = (q = '') =>
  queryOptions({ queryKey: lessonKeys.list(q), queryFn: ({ signal }) => getLessons(q, signal), placeholderData: keepPreviousData });

export const useLessons = (q = '') => useQuery(lessonsQueryOptions(q));

/** A curation answer is the unfiltered book: store it, and let filtered views refetch. */
export function storeLessonBook(qc: QueryClient, book: LessonBook) {
  qc.setQueryData(lessonKeys.list(''), book);
  return qc.invalidateQueries({ queryKey: lessonKeys.all, predicate: (q) => q.queryKey[2] !== '' });
}
