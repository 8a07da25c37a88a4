import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Case } from '../../../../shared/schemas/case';
import { api } from '../../../lib/api-client';
import { caseKeys } from './case-keys';

export const getCase = (id: number, signal?: AbortSignal) => api<{ case: Case }>(`/api/cases/${id}`, { signal });

export const caseQueryOptions = (id: number) =>
  queryOptions({ queryKey: caseKeys.detail(id), queryFn: ({ signal }) => getCase(id, signal), enabled: Number.isInteger(id) && id > 0 });

export const useCase = (id: number) => useQuery(caseQueryOptions(id));
