import type { CaseListFilters } from './list-cases';

/** Hierarchical query keys: invalidating `all` refreshes every case list, page, comment and revision. */
export const caseKeys = {
  all: ['cases'] as const,
  lists: () => ['cases', 'list'] as const,
  list: (filters: CaseListFilters) => ['cases', 'list', filters] as const,
  authors: () => ['cases', 'authors'] as const,
  references: (ids: number[]) => ['cases', 'references', ids.join(',')] as const,
  detail: (id: number) => ['cases', 'detail', id] as const,
  comments: (id: number) => ['cases', 'detail', id, 'comments'] as const,
  revisions: (id: number) => ['cases', 'detail', id, 'revisions'] as const,
};
