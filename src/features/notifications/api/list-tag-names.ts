import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TagInfo } from '../../../../shared/schemas/tags';
import { api } from '../../../lib/api-client';

/** The tag list (the same `['tags','list']` entry tag curation keeps fresh), to offer tags to watch. */
export const listTagNames = (signal?: AbortSignal) => api<{ tags: TagInfo[] }>('/api/tags', { signal });

export const tagNamesQueryOptions = () => queryOptions({ queryKey: ['tags', 'list'] as const, queryFn: ({ signal }) => listTagNames(signal) });

export const useTagNames = () => useQuery(tagNamesQueryOptions());
