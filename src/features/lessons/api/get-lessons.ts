import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export interface Lesson {
  caseId: number;
  title: string;
  cause: string | null;
  lessonSummary: string;
  lessonDetail: string | null;
  verifiedAt: string | null;
  pinned: boolean;
  pinPosition: number | null;
}

export interface LessonGroup {
  cause: string;
  label: string;
  lessons: Lesson[];
}

/** Verified lessons grouped by cause, and the pinned bench checklist in its order. */
export interface LessonBook {
  groups: LessonGroup[];
  checklist: Lesson[];
}

export const lessonKeys = {
  all: ['lessons'] as const,
  list: (q: string) => ['lessons', 'list', q] as const,
};

export const getLessons = (q: string, signal?: AbortSignal) => api<LessonBook>(`/api/lessons${q ? `?${new URLSearchParams({ q })}` : ''}`, { signal });

export const lessonsQueryOptions = (q = '') =>
  queryOptions({ queryKey: lessonKeys.list(q), queryFn: ({ signal }) => getLessons(q, signal), placeholderData: keepPreviousData });

export const useLessons = (q = '') => useQuery(lessonsQueryOptions(q));
