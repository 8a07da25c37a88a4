import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SavedSearch } from '../../../../shared/schemas/saved-searches';
import { api } from '../../../lib/api-client';
import { savedSearchKeys } from './saved-search-keys';

export const listSavedSearches = (signal?: AbortSignal) => api<{ savedSearches: SavedSearch[] }>('/api/profile/saved-searches', { signal });

export const savedSearchesQueryOptions = () => queryOptions({ queryKey: savedSearchKeys.list(), queryFn: ({ signal }) => listSavedSearches(signal) });

export const useSavedSearches = () => useQuery(savedSearchesQueryOptions());
