import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CaptureAttachmentPatch } from '../../../../shared/schemas/capture-attachment';
import type { Attachment } from '../../../../shared/schemas/case';
import { api } from '../../../lib/api-client';

/** Analyse another channel of a stored capture, or mark it before or after the fix. */
export const updateCapture = ({ attachmentId, ...patch }: CaptureAttachmentPatch & { attachmentId: number }) =>
  api<{ attachment: Attachment }>(`/api/attachments/${attachmentId}/capture`, { method: 'PATCH', body: patch });

export function useUpdateCapture() {
  const qc = useQueryClient();
  // the case carries the stored analysis, so the whole case is fetched again
  return useMutation({ mutationFn: updateCapture, onSettled: () => qc.invalidateQueries({ queryKey: ['cases'] }) });
}
