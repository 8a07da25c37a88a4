import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SavedSearch, SavedSearchInput } from '../../../../shared/schemas/saved-searches';
import { api } from '../../../lib/api-client';
import { savedSearchKeys } from './saved-search-keys';

export const createSavedSearch = (input: SavedSearchInput) =>
  api<{ savedSearch: SavedSearch }>('/api/profile/saved-searches', { method: 'POST', body: input });

export function useCreateSavedSearch() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createSavedSearch, onSuccess: () => qc.invalidateQueries({ queryKey: savedSearchKeys.all }) });
}
