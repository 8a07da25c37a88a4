import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AuditEntry } from '../../../../shared/schemas/review';
import { api } from '../../../lib/api-client';
import { reviewKeys } from './review-keys';

export const getCaseHistory = (caseId: number, signal?: AbortSignal) => api<{ history: AuditEntry[] }>(`/api/cases/${caseId}/history`, { signal });

export const caseHistoryQueryOptions = (caseId: number) =>
  queryOptions({ queryKey: reviewKeys.history(caseId), queryFn: ({ signal }) => getCaseHistory(caseId, signal) });

export const useCaseHistory = (caseId: number, enabled = true) => useQuery({ ...caseHistoryQueryOptions(caseId), enabled });
