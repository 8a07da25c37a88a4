import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { caseKeys } from './case-keys';

export interface CaseAuthor {
  id: number;
  name: string;
}

export const listCaseAuthors = () => api<{ authors: CaseAuthor[] }>('/api/cases/authors');

export const caseAuthorsQueryOptions = () => queryOptions({ queryKey: caseKeys.authors(), queryFn: listCaseAuthors, staleTime: 5 * 60_000 });

export const useCaseAuthors = () => useQuery(caseAuthorsQueryOptions());
