import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { CaseListQuery, CaseSummary } from '../../../../shared/schemas/case';
import { api } from '../../../lib/api-client';
import { caseKeys } from './case-keys';

/** The table's filters as the URL holds them (strings; empty ones left out). */
export type CaseListFilters = Partial<Record<keyof CaseListQuery, string>>;

export interface CaseList {
  cases: CaseSummary[];
  total: number;
  /** The list stopped counting at `total`: there are at least that many. */
  totalCapped?: boolean;
  page: number;
  pageSize: number;
}

export function listCases(filters: CaseListFilters, signal?: AbortSignal) {
  const params = new URLSearchParams();
  for (const [k, v] of Object.entries(filters)) if (v) params.set(k, v);
  const qs = params.toString();
  return api<CaseList>(`/api/cases${qs ? `?${qs}` : ''}`, { signal });
}

export const casesQueryOptions = (filters: CaseListFilters) =>
  queryOptions({
    queryKey: caseKeys.list(filters),
    queryFn: ({ signal }) => listCases(filters, signal),
    placeholderData: keepPreviousData,
  });

export const useCases = (filters: CaseListFilters) => useQuery(casesQueryOptions(filters));
