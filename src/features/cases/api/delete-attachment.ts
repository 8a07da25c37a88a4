import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { caseKeys } from './case-keys';

export const deleteAttachment = ({ caseId, attachmentId }: { caseId: number; attachmentId: number }) =>
  api<void>(`/api/cases/${caseId}/attachments/${attachmentId}`, { method: 'DELETE' });

export function useDeleteAttachment() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deleteAttachment, onSettled: () => qc.invalidateQueries({ queryKey: caseKeys.all }) });
}
