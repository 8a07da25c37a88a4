import { api } from '../../../lib/api-client';
import type { TagList } from './list-tags';
import { useTagMutation } from './use-tag-mutation';

export const renameTag = ({ tag, to }: { tag: string; to: string }) =>
  api<TagList>(`/api/tags/${encodeURIComponent(tag)}/rename`, { method: 'POST', body: { to } });

export const useRenameTag = () => useTagMutation(renameTag);
