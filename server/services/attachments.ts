import { open, readFile, rm } from 'node:fs/promises';
import { canEditCase } from '../../shared/auth/case-policy';
import type { Actor } from '../../shared/auth/roles';
import type { Attachment } from '../../shared/schemas/case';
import path from 'node:path';
import { captureWorkers } from '../captures/capture-pool';
import { plotStoreDirFor } from '../captures/capture-store';
import { deleteAttachmentRow, findAttachment, insertAttachment } from '../db/repositories/attachments';
import { updateCaseRow } from '../db/repositories/cases';
import type { AppDeps } from '../deps';
import { AppError, forbidden, notFound } from '../errors';
import { storagePaths } from '../storage';
import { toAttachment } from './case-mapper';
import { visibleCaseRow } from './cases';
import { reencodeImage, sniffImage } from './image-intake';
import { caseChanged } from '../search/change-log';

export const IMAGE_LIMIT_BYTES = 10 * 1024 * 1024;

export interface IncomingFile {
  path: string;
  originalName: string;
  sizeBytes: number;
}

async function readHead(file: string, bytes = 64): Promise<Buffer> {
  const fh = await open(file, 'r');
  try {
    const buf = Buffer.alloc(bytes);
    const { bytesRead } = await fh.read(buf, 0, bytes, 0);
    return buf.subarray(0, bytesRead);
  } finally {
    await fh.close();
  }
}

// A capture's name that hides an image is refused, not silently reinterpreted.
const TEXT_EXTENSIONS = new Set(['csv', 'tsv', 'txt', 'dat']);

const cleanName = (name: string) => name.replace(/[\\/\0\r\n"]/g, '_').slice(0, 200) || 'upload';

/**
 * Accepts a screenshot (PNG, JPEG, GIF, BMP by content) or a CSV capture into a case the actor may
 * edit. A refused file leaves nothing behind: the temp file is always removed, stored files only
 * exist once their row does.
 */
export async function addAttachment(deps: AppDeps, actor: Actor, caseId: number, file: IncomingFile): Promise<Attachment> {
  const storage = storagePaths(deps.config);
  const written: string[] = [];
  try {
    const row = await visibleCaseRow(deps.db, actor, caseId);
    if (!canEditCase(actor, { authorId: row.author_id, status: row.status })) throw forbidden('Only the author or a moderator may add attachments to this case');
    const format = sniffImage(await readHead(file.path));
    const now = new Date().toISOString();
    let attachment;
    const ext = file.originalName.toLowerCase().match(/\.([a-z0-9]+)$/)?.[1] ?? '';
    if (format && TEXT_EXTENSIONS.has(ext)) {
      throw new AppError('unsupported_type', `The file is named .${ext} but its content is a ${format.toUpperCase()} image; rename it or attach the right file`);
    }
    if (format) {
      if (file.sizeBytes > IMAGE_LIMIT_BYTES) throw new AppError('too_large', `Screenshots are limited to 10 MB; this one is ${(file.sizeBytes / 1048576).toFixed(1)} MB`);
      const img = await reencodeImage(await readFile(file.path), format);
      if (img === null) throw new AppError('unsupported_type', `The file starts like a ${format.toUpperCase()} image but does not decode as one`);
      if (img === 'too_many_pixels') throw new AppError('too_large', 'The image has too many pixels (over 60 megapixels); crop or scale it first');
      const name = storage.newName(img.extension);
      const thumb = storage.newName(img.extension).replace(/(\.\w+)$/, '.thumb$1');
      await storage.write(name, img.image);
      written.push(name);
      await storage.write(thumb, img.thumbnail);
      written.push(thumb);
      attachment = await insertAttachment(deps.db, {
        case_id: caseId,
        uploaded_by: actor.id,
        kind: 'screenshot',
        storage_name: name,
        thumbnail_name: thumb,
        original_name: cleanName(file.originalName),
        content_type: img.contentType,
        size_bytes: img.image.length,
        width: img.width,
        height: img.height,
        created_at: now,
      });
    } else {
      const name = storage.newName('csv');
      // the compact samples the plots read are written in the same pass as the analysis
      const plotDir = plotStoreDirFor(storage.fileFor(name));
      written.push(path.basename(plotDir));
      const result = await captureWorkers.analyze(file.path, {}, { plotDir });
      if (!result.ok) throw new AppError('unsupported_type', `Not an accepted screenshot (PNG, JPEG, GIF, BMP) or CSV capture: ${result.message}`);
      await storage.moveIn(file.path, name);
      written.push(name);
      attachment = await insertAttachment(deps.db, {
        case_id: caseId,
        uploaded_by: actor.id,
        kind: 'capture',
        storage_name: name,
        thumbnail_name: null,
        original_name: cleanName(file.originalName),
        content_type: 'text/csv; charset=utf-8',
        size_bytes: file.sizeBytes,
        width: null,
        height: null,
        analysis: JSON.stringify(result.analysis),
        created_at: now,
      });
    }
    await updateCaseRow(deps.db, caseId, { updated_at: now });
    await caseChanged(deps, caseId);
    return toAttachment(attachment);
  } catch (err) {
    await Promise.all(written.map((n) => rm(storage.fileFor(n), { recursive: true, force: true })));
    throw err;
  } finally {
    await rm(file.path, { force: true });
  }
}

export async function removeAttachment(deps: AppDeps, actor: Actor, caseId: number, attachmentId: number): Promise<void> {
  const row = await visibleCaseRow(deps.db, actor, caseId);
  if (!canEditCase(actor, { authorId: row.author_id, status: row.status })) throw forbidden('Only the author or a moderator may remove attachments');
  const att = await findAttachment(deps.db, attachmentId);
  if (!att || att.case_id !== caseId) throw notFound('No such attachment on this case');
  await deleteAttachmentRow(deps.db, attachmentId);
  await updateCaseRow(deps.db, caseId, { updated_at: new Date().toISOString() });
  await caseChanged(deps, caseId);
  const storage = storagePaths(deps.config);
  await storage.remove(att.storage_name);
  if (att.thumbnail_name) await storage.remove(att.thumbnail_name);
}

/** Where an attachment's bytes are, for a caller who may see its case. */
export async function attachmentFile(deps: AppDeps, actor: Actor, attachmentId: number, variant: 'file' | 'thumbnail') {
  const att = await findAttachment(deps.db, attachmentId);
  if (!att) throw notFound('No such attachment');
  await visibleCaseRow(deps.db, actor, att.case_id);
  const name = variant === 'thumbnail' ? att.thumbnail_name : att.storage_name;
  if (!name) throw notFound('This attachment has no thumbnail');
  return { path: storagePaths(deps.config).fileFor(name), contentType: att.content_type, originalName: att.original_name, kind: att.kind };
}
