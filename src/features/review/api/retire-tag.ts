import { api } from '../../../lib/api-client';
import type { TagList } from './list-tags';
import { useTagMutation } from './use-tag-mutation';

export const retireTag = ({ tag, retired }: { tag: string; retired: boolean }) =>
  api<TagList>(`/api/tags/${encodeURIComponent(tag)}/retire`, { method: 'POST', body: { retired } });

export const useRetireTag = () => useTagMutation(retireTag);
