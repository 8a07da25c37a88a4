import { api } from '../../../lib/api-client';
import type { TagList } from './list-tags';
import { useTagMutation } from './use-tag-mutation';

export const setTagSynonyms = ({ tag, synonyms }: { tag: string; synonyms: string[] }) =>
  api<TagList>(`/api/tags/${encodeURIComponent(tag)}/synonyms`, { method: 'PUT', body: { synonyms } });

export const useSetTagSynonyms = () => useTagMutation(setTagSynonyms);
