import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { TagList } from './list-tags';
import { tagKeys } from './review-keys';

/**
 * Every curation endpoint answers with the whole tag list: put it in the cache, and refresh
 * case lists and pages, whose tags may have been renamed or merged.
 */
export function useTagMutation<V>(mutationFn: (vars: V) => Promise<TagList>) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn,
    onSuccess: (data) => {
      qc.setQueryData(tagKeys.list(), data);
      return qc.invalidateQueries({ queryKey: ['cases'] });
    },
  });
}
