import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Revision } from '../../../../shared/schemas/case';
import { api } from '../../../lib/api-client';
import { caseKeys } from './case-keys';

/** Newest first; each snapshot holds the write-up as it stood after that save. */
export const listRevisions = (caseId: number) => api<{ revisions: Revision[] }>(`/api/cases/${caseId}/revisions`);

export const revisionsQueryOptions = (caseId: number) => queryOptions({ queryKey: caseKeys.revisions(caseId), queryFn: () => listRevisions(caseId) });

export const useRevisions = (caseId: number) => useQuery(revisionsQueryOptions(caseId));
