import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Comment } from '../../../../shared/schemas/case';
import { api } from '../../../lib/api-client';
import { caseKeys } from './case-keys';

export const listComments = (caseId: number) => api<{ comments: Comment[] }>(`/api/cases/${caseId}/comments`);

export const commentsQueryOptions = (caseId: number) => queryOptions({ queryKey: caseKeys.comments(caseId), queryFn: () => listComments(caseId) });

export const useComments = (caseId: number) => useQuery(commentsQueryOptions(caseId));
