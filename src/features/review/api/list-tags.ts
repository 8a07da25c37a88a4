import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TagInfo } from '../../../../shared/schemas/tags';
import { api } from '../../../lib/api-client';
import { tagKeys } from './review-keys';

export type TagList = { tags: TagInfo[] };

export const listTags = (signal?: AbortSignal) => api<TagList>('/api/tags', { signal });

export const tagsQueryOptions = () => queryOptions({ queryKey: tagKeys.list(), queryFn: ({ signal }) => listTags(signal) });

export const useTags = () => useQuery(tagsQueryOptions());
