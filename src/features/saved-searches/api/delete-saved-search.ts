import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { savedSearchKeys } from './saved-search-keys';

export const deleteSavedSearch = (id: number) => api<void>(`/api/profile/saved-searches/${id}`, { method: 'DELETE' });

export function useDeleteSavedSearch() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deleteSavedSearch, onSuccess: () => qc.invalidateQueries({ queryKey: savedSearchKeys.all }) });
}
