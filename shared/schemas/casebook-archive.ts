import { z } from 'zod';
import { emailSchema, personNameSchema, roleSchema } from './auth';
import { ATTACHMENT_KINDS, caseCreateSchema, caseListQuerySchema, caseSetupSchema, caseStatusSchema, commentInputSchema, statedCauseSchema, tagSchema } from './case';

/**
 * The casebook archive: a zip of JSON files (one array of records each), one Markdown file per
 * case and the attachments' bytes. Our own format; `casebook.json` names it and holds a SHA-256
 * of every other file, so a damaged archive is recognised before anything is imported.
 */
export const ARCHIVE_FORMAT = 'falsetrace-casebook';
export const ARCHIVE_VERSION = 1;

export const ARCHIVE_FILES = {
  manifest: 'casebook.json',
  users: 'users.json',
  cases: 'cases.json',
  revisions: 'revisions.json',
  comments: 'comments.json',
  attachments: 'attachments.json',
  history: 'history.json',
  pinned: 'pinned-lessons.json',
} as const;

const id = z.number({ error: 'must be a number' }).int('must be a whole number').positive('must be positive');
const time = z.iso.datetime({ error: 'must be an ISO date-time such as 2026-05-19T10:05:00.000Z' });
const sha256 = z.string().regex(/^[0-9a-f]{64}$/, 'must be a SHA-256 in hex');
/** A path inside the archive: relative, forward slashes, no way out of the archive. */
const entryPath = z
  .string()
  .max(400)
  .regex(/^(?!\/)(?!.*(?:^|\/)\.\.(?:\/|$))[^\\\0]+$/, 'must be a relative path inside the archive');

/** The filters of `GET /api/admin/casebook/export`: those of the case list, without paging. */
export const casebookExportQuerySchema = caseListQuerySchema.pick({ q: true, cause: true, tag: true, status: true, author: true, from: true, to: true });
export type CasebookExportQuery = z.infer<typeof casebookExportQuerySchema>;

export const archiveManifestSchema = z.object({
  format: z.literal(ARCHIVE_FORMAT, { error: `is not a ${ARCHIVE_FORMAT} archive` }),
  version: z.literal(ARCHIVE_VERSION, { error: `is a version this Falsetrace cannot read (it reads version ${ARCHIVE_VERSION})` }),
  exportedAt: time,
  /** The case-list filters the export used; empty for the whole casebook. */
  filters: z.record(z.string(), z.string()),
  files: z.record(entryPath, sha256),
});
export type ArchiveManifest = z.infer<typeof archiveManifestSchema>;

export const archivedUserSchema = z.object({ id, email: emailSchema, name: personNameSchema, role: roleSchema });
export type ArchivedUser = z.infer<typeof archivedUserSchema>;

const write = caseCreateSchema.shape;
export const archivedCaseSchema = z.object({
  id,
  authorId: id,
  title: write.title,
  summary: write.summary,
  narrative: z.string().max(50_000),
  setup: caseSetupSchema,
  statedCause: statedCauseSchema.nullable(),
  statedCauseOther: write.statedCauseOther,
  fix: write.fix,
  lessonSummary: write.lessonSummary,
  lessonDetail: write.lessonDetail,
  /** Absent in archives written before the field existed. */
  safetyNote: write.safetyNote,
  /** The author's tags; the engine's are recomputed on import. */
  tags: z.array(tagSchema).max(12, 'At most 12 tags'),
  status: caseStatusSchema,
  reviewNote: z.string().max(5000).nullable(),
  /** Where the case first came from (server/casebook/origin-key.ts); absent in older archives, then derived on import. */
  originKey: sha256.optional(),
  /** An archive record number (this archive's `id` of the original), renumbered on import. */
  duplicateOf: id.nullable(),
  retiredReason: z.string().max(5000).nullable(),
  createdAt: time,
  updatedAt: time,
  submittedAt: time.nullable(),
  verifiedAt: time.nullable(),
});
export type ArchivedCase = z.infer<typeof archivedCaseSchema>;

export const archivedRevisionSchema = z.object({
  id,
  caseId: id,
  number: id,
  authorId: id.nullable(),
  snapshot: caseCreateSchema,
  createdAt: time,
});
export type ArchivedRevision = z.infer<typeof archivedRevisionSchema>;

export const archivedCommentSchema = z.object({
  id,
  caseId: id,
  authorId: id,
  body: commentInputSchema.shape.body,
  hidden: z.boolean(),
  hiddenBy: id.nullable(),
  createdAt: time,
  updatedAt: time,
});
export type ArchivedComment = z.infer<typeof archivedCommentSchema>;

export const ARCHIVE_CONTENT_TYPES = ['image/png', 'image/jpeg', 'text/csv; charset=utf-8'] as const;

export const archivedAttachmentSchema = z
  .object({
    id,
    caseId: id,
    uploadedBy: id.nullable(),
    kind: z.enum(ATTACHMENT_KINDS),
    originalName: z.string().min(1).max(200),
    contentType: z.enum(ARCHIVE_CONTENT_TYPES, { error: `must be one of ${ARCHIVE_CONTENT_TYPES.join(', ')}` }),
    sizeBytes: z.number().int().min(0),
    width: z.number().int().positive().nullable(),
    height: z.number().int().positive().nullable(),
    analysis: z.record(z.string(), z.unknown()).nullable(),
    createdAt: time,
    file: entryPath,
    sha256,
    thumbnail: entryPath.nullable(),
  })
  .refine((a) => (a.kind === 'capture') === a.contentType.startsWith('text/csv'), { error: 'kind and content type disagree', path: ['contentType'] });
export type ArchivedAttachment = z.infer<typeof archivedAttachmentSchema>;

/** One entry of a case's review and moderation history (the audit log). */
export const archivedHistorySchema = z.object({
  id,
  caseId: id,
  actorId: id.nullable(),
  action: z.string().min(1).max(60),
  before: z.unknown().nullable(),
  after: z.unknown().nullable(),
  note: z.string().max(5000).nullable(),
  createdAt: time,
});
export type ArchivedHistory = z.infer<typeof archivedHistorySchema>;

export const archivedPinSchema = z.object({ caseId: id, position: id });

export const IMPORT_KINDS = ['user', 'case', 'revision', 'comment', 'attachment', 'history', 'pin'] as const;
export type ImportKind = (typeof IMPORT_KINDS)[number];

export interface ImportNote {
  kind: ImportKind;
  /** The record's id in the archive, when it had a readable one. */
  id: number | null;
  reason: string;
}

/** What an import did (or, for a dry run, would do). */
export interface CasebookImportReport {
  dryRun: boolean;
  imported: Record<'users' | 'cases' | 'revisions' | 'comments' | 'attachments' | 'history' | 'pins', number>;
  /** Records already here (same id): left as they are. */
  skipped: ImportNote[];
  /** Records that failed validation, or belong to a record that did. */
  refused: ImportNote[];
  notes: string[];
}
