import { api } from '../../../lib/api-client';
import type { TagList } from './list-tags';
import { useTagMutation } from './use-tag-mutation';

export const mergeTag = ({ tag, into }: { tag: string; into: string }) =>
  api<TagList>(`/api/tags/${encodeURIComponent(tag)}/merge`, { method: 'POST', body: { into } });

export const useMergeTag = () => useTagMutation(mergeTag);
