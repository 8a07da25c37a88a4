import type { SearchParams } from './search-cases';

/**
 * Search keys live under the cases' `['cases']` prefix on purpose: every case mutation
 * invalidates that prefix, so results and similar cases refresh after an edit without the
 * cases feature knowing search exists.
 */
export const searchKeys = {
  all: ['cases', 'search'] as const,
  results: (params: SearchParams) => ['cases', 'search', params] as const,
  similar: (caseId: number) => ['cases', 'detail', caseId, 'similar'] as const,
};
