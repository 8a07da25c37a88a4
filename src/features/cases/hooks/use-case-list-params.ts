import { useCallback, useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import type { CaseListFilters } from '../api/list-cases';

export const FILTER_KEYS = ['q', 'cause', 'tag', 'status', 'author', 'from', 'to'] as const;
export const PAGE_SIZES = [10, 20, 50, 100];
export const DEFAULT_SORT = '-updatedAt';

/**
 * The table's filters, sort and page live in the URL, so a link reproduces the view and the
 * back button steps through earlier ones. Changing a filter or the sort returns to page 1.
 */
export function useCaseListParams() {
  const [params, setParams] = useSearchParams();
  const filters = useMemo<CaseListFilters>(() => {
    const f: CaseListFilters = {};
    for (const k of [...FILTER_KEYS, 'page', 'pageSize', 'sort'] as const) {
      const v = params.get(k);
      if (v) f[k] = v;
    }
    return f;
  }, [params]);

  const update = useCallback(
    (changes: CaseListFilters, options: { replace?: boolean } = {}) => {
      setParams(
        (prev) => {
          const next = new URLSearchParams(prev);
          for (const [k, v] of Object.entries(changes)) {
            if (v) next.set(k, v);
            else next.delete(k);
          }
          if (!('page' in changes)) next.delete('page');
          return next;
        },
        { replace: options.replace },
      );
    },
    [setParams],
  );

  const page = Math.max(1, Number(filters.page ?? 1) || 1);
  const pageSize = PAGE_SIZES.includes(Number(filters.pageSize)) ? Number(filters.pageSize) : 20;
  const sort = filters.sort ?? DEFAULT_SORT;
  const active = FILTER_KEYS.some((k) => filters[k]);
  return { filters, update, page, pageSize, sort, active };
}
