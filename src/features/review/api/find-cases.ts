import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { Case, CaseSummary } from '../../../../shared/schemas/case';
import { api } from '../../../lib/api-client';

/** Case look-ups for the duplicate picker, keyed like the case lists so a decision's `['cases']` invalidation covers them. */
export const findCases = (q: string, signal?: AbortSignal) =>
  api<{ cases: CaseSummary[]; total: number }>(`/api/cases?${new URLSearchParams({ q, pageSize: '8' })}`, { signal });

export const findCasesQueryOptions = (q: string) =>
  queryOptions({
    queryKey: ['cases', 'list', { q, pageSize: '8' }] as const,
    queryFn: ({ signal }) => findCases(q, signal),
    enabled: q.trim().length >= 2,
    placeholderData: keepPreviousData,
  });

export const useFindCases = (q: string) => useQuery(findCasesQueryOptions(q));

export const getCaseById = (id: number, signal?: AbortSignal) => api<{ case: Case }>(`/api/cases/${id}`, { signal });

export const useCaseById = (id: number | null) =>
  useQuery({ queryKey: ['cases', 'detail', id] as const, queryFn: ({ signal }) => getCaseById(id!, signal), enabled: id !== null && id > 0 });
