import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Watches } from './get-watches';
import { notificationKeys } from './notification-keys';

/** `POST` starts watching a tag, `DELETE` stops; both answer `{ watching }`. */
export const setTagWatch = ({ tag, watching }: { tag: string; watching: boolean }) =>
  api<{ watching: boolean }>(`/api/tags/${encodeURIComponent(tag)}/watch`, { method: watching ? 'POST' : 'DELETE' });

export function useSetTagWatch() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: setTagWatch,
    onSuccess: ({ watching }, { tag }) => {
      qc.setQueryData<Watches>(notificationKeys.watches(), (w) =>
        w ? { ...w, tags: watching ? [...new Set([...w.tags, tag])].sort() : w.tags.filter((t) => t !== tag) } : w,
      );
      return qc.invalidateQueries({ queryKey: notificationKeys.watches() });
    },
  });
}
