import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { SearchResponse } from '../../../../shared/schemas/search';
import { api } from '../../../lib/api-client';
import { searchKeys } from './search-keys';

/** What the Bench box sends: the text as typed (a trailing space marks a finished word) and the facet filters. */
export interface SearchParams {
  q: string;
  cause?: string;
  tag?: string;
  status?: string;
  page?: number;
  pageSize?: number;
}

export function searchCases(params: SearchParams, signal?: AbortSignal) {
  const qs = new URLSearchParams();
  for (const [k, v] of Object.entries(params)) if (v !== undefined && v !== '') qs.set(k, String(v));
  return api<SearchResponse>(`/api/search?${qs.toString()}`, { signal });
}

export const searchQueryOptions = (params: SearchParams) =>
  queryOptions({
    queryKey: searchKeys.results(params),
    queryFn: ({ signal }) => searchCases(params, signal),
    // keep the last results on screen while the next keystroke's arrive
    placeholderData: keepPreviousData,
    staleTime: 5_000,
    enabled: params.q.trim() !== '' || Boolean(params.cause || params.tag || params.status),
  });

export const useSearchCases = (params: SearchParams) => useQuery(searchQueryOptions(params));
