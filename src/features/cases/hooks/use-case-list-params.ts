import { useCallback } from 'react';
import { useUrlState } from '../../../lib/url-state';
import type { CaseListFilters } from '../api/list-cases';

export const FILTER_KEYS = ['q', 'cause', 'tag', 'status', 'author', 'from', 'to'] as const;
export const PAGE_SIZES = [10, 20, 50, 100];
export const DEFAULT_SORT = '-updatedAt';
const URL_KEYS = [...FILTER_KEYS, 'page', 'pageSize', 'sort'] as const;

/**
 * The table's filters, sort and page live in the URL, so a link reproduces the view and the
 * back button steps through earlier ones. Changing a filter or the sort returns to page 1.
 */
export function useCaseListParams() {
  const { values: filters, write } = useUrlState(URL_KEYS);

  const update = useCallback(
    (changes: CaseListFilters, options: { replace?: boolean } = {}) => write(changes, { replace: options.replace, drop: ['page'] }),
    [write],
  );

  const page = Math.max(1, Number(filters.page ?? 1) || 1);
  const pageSize = PAGE_SIZES.includes(Number(filters.pageSize)) ? Number(filters.pageSize) : 20;
  const sort = filters.sort ?? DEFAULT_SORT;
  const active = FILTER_KEYS.some((k) => filters[k]);
  return { filters: filters as CaseListFilters, update, page, pageSize, sort, active };
}
