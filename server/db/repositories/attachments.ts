import type { Insertable, Selectable } from 'kysely';
import type { AttachmentsTable, Db } from '../database';

export type AttachmentRow = Selectable<AttachmentsTable>;

export const insertAttachment = (db: Db, row: Insertable<AttachmentsTable>) =>
  db.insertInto('attachments').values(row).returningAll().executeTakeFirstOrThrow();

export const findAttachment = (db: Db, id: number) => db.selectFrom('attachments').selectAll().where('id', '=', id).executeTakeFirst();

export const listAttachments = (db: Db, caseId: number) =>
  db.selectFrom('attachments').selectAll().where('case_id', '=', caseId).orderBy('id').execute();

export const deleteAttachmentRow = (db: Db, id: number) => db.deleteFrom('attachments').where('id', '=', id).execute();
