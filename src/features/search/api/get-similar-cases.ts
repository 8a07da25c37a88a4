import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SimilarResponse } from '../../../../shared/schemas/search';
import { api } from '../../../lib/api-client';
import { searchKeys } from './search-keys';

export const getSimilarCases = (caseId: number, signal?: AbortSignal) => api<SimilarResponse>(`/api/cases/${caseId}/similar`, { signal });

export const similarCasesQueryOptions = (caseId: number) =>
  queryOptions({
    queryKey: searchKeys.similar(caseId),
    queryFn: ({ signal }) => getSimilarCases(caseId, signal),
    enabled: Number.isInteger(caseId) && caseId > 0,
  });

export const useSimilarCases = (caseId: number) => useQuery(similarCasesQueryOptions(caseId));
