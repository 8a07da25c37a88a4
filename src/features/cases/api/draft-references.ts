import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { MAX_REFERENCES_PER_TEXT, referencedCaseIds, type CaseReference } from '../../../../shared/cases/case-references';
import { api } from '../../../lib/api-client';
import { caseKeys } from './case-keys';

/**
 * The cases a text being written names as `#123` that the writer may open, so its preview links
 * them as the saved page will. Asked again only when the set of numbers changes, not per keystroke.
 */
export function useDraftReferences(...texts: (string | null | undefined)[]): CaseReference[] {
  const ids = referencedCaseIds(...texts)
    .slice(0, MAX_REFERENCES_PER_TEXT)
    .sort((a, b) => a - b);
  const query = useQuery({
    queryKey: caseKeys.references(ids),
    queryFn: ({ signal }) => api<{ references: CaseReference[] }>(`/api/cases/references?ids=${ids.join(',')}`, { signal }),
    enabled: ids.length > 0,
    placeholderData: keepPreviousData,
    staleTime: 60_000,
  });
  return ids.length > 0 ? (query.data?.references ?? []) : [];
}
