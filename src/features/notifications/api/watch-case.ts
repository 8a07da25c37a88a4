import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Watches } from './get-watches';
import { notificationKeys } from './notification-keys';

/** `POST` starts watching a case, `DELETE` stops; both answer `{ watching }`. */
export const setCaseWatch = ({ caseId, watching }: { caseId: number; watching: boolean }) =>
  api<{ watching: boolean }>(`/api/cases/${caseId}/watch`, { method: watching ? 'POST' : 'DELETE' });

export function useSetCaseWatch() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: setCaseWatch,
    onSuccess: ({ watching }, { caseId }) => {
      qc.setQueryData<Watches>(notificationKeys.watches(), (w) =>
        w ? { ...w, cases: watching ? [...new Set([...w.cases, caseId])] : w.cases.filter((id) => id !== caseId) } : w,
      );
      return qc.invalidateQueries({ queryKey: notificationKeys.watches() });
    },
  });
}
