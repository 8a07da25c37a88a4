import { canEditCase } from '../../shared/auth/case-policy';
import type { Actor } from '../../shared/auth/roles';
import type { Attachment } from '../../shared/schemas/case';
import type { CaptureAttachmentPatch } from '../../shared/schemas/capture-attachment';
import { captureWorkers } from '../captures/capture-pool';
import { findAttachment } from '../db/repositories/attachments';
import { updateCaseRow } from '../db/repositories/cases';
import type { AppDeps } from '../deps';
import { AppError, forbidden, notFound } from '../errors';
import { storagePaths } from '../storage';
import { toAttachment } from './case-mapper';
import { visibleCaseRow } from './cases';

/**
 * Re-analyses a stored capture on another channel and/or marks it before or after the fix, for
 * someone who may edit its case. The stored analysis is replaced only once the new one has been
 * read, so a channel that cannot be read leaves the attachment as it was.
 */
export async function updateCaptureAttachment(deps: AppDeps, actor: Actor, attachmentId: number, patch: CaptureAttachmentPatch): Promise<Attachment> {
  const att = await findAttachment(deps.db, attachmentId);
  if (!att) throw notFound('No such attachment');
  const row = await visibleCaseRow(deps.db, actor, att.case_id);
  if (!canEditCase(actor, { authorId: row.author_id, status: row.status })) throw forbidden('Only the author or a moderator may change this capture');
  if (att.kind !== 'capture') throw new AppError('invalid_input', 'This attachment is a screenshot, not a waveform capture');
  const changes: { analysis?: string; capture_channel?: number; capture_role?: 'before' | 'after' | null } = {};
  if (patch.channel !== undefined) {
    const result = await captureWorkers.analyze(storagePaths(deps.config).fileFor(att.storage_name), { channel: patch.channel });
    if (!result.ok) throw new AppError('invalid_input', `Channel ${patch.channel} cannot be analysed: ${result.message}`, [{ path: 'channel', message: result.message }]);
    changes.analysis = JSON.stringify(result.analysis);
    changes.capture_channel = patch.channel;
  }
  if (patch.role !== undefined) changes.capture_role = patch.role;
  const now = new Date().toISOString();
  await deps.db.transaction().execute(async (trx) => {
    if (patch.role) {
      await trx.updateTable('attachments').set({ capture_role: null }).where('case_id', '=', att.case_id).where('capture_role', '=', patch.role).execute();
    }
    if (Object.keys(changes).length > 0) await trx.updateTable('attachments').set(changes).where('id', '=', attachmentId).execute();
  });
  await updateCaseRow(deps.db, att.case_id, { updated_at: now });
  const updated = await findAttachment(deps.db, attachmentId);
  return toAttachment(updated!);
}
