import { createHash } from 'node:crypto';
import type { z } from 'zod';
import {
  ARCHIVE_FILES,
  archivedAttachmentSchema,
  archivedCaseSchema,
  archivedCommentSchema,
  archivedHistorySchema,
  archivedPinSchema,
  archivedRevisionSchema,
  archivedUserSchema,
  archiveManifestSchema,
  type ArchiveManifest,
  type ArchivedAttachment,
  type ArchivedCase,
  type ArchivedComment,
  type ArchivedHistory,
  type ArchivedRevision,
  type ArchivedUser,
  type ImportKind,
  type ImportNote,
} from '../../shared/schemas/casebook-archive';
import { sniffImage } from '../services/image-intake';

/** A whole archive refused before any record is looked at: damaged, foreign, or incomplete. */
export class ArchiveRefused extends Error {}

const sha256 = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex');

function readJson(files: Map<string, Uint8Array>, name: string): unknown {
  const bytes = files.get(name);
  if (!bytes) throw new ArchiveRefused(`${name} is missing from the archive`);
  try {
    return JSON.parse(Buffer.from(bytes).toString('utf8'));
  } catch {
    throw new ArchiveRefused(`${name} is not valid JSON`);
  }
}

/** The manifest, after checking that every file it lists is present and unchanged. */
export function verifiedManifest(files: Map<string, Uint8Array>): ArchiveManifest {
  const parsed = archiveManifestSchema.safeParse(readJson(files, ARCHIVE_FILES.manifest));
  if (!parsed.success) {
    const i = parsed.error.issues[0];
    throw new ArchiveRefused(`${ARCHIVE_FILES.manifest} ${i.path.length ? `${i.path.join('.')} ` : ''}${i.message}`);
  }
  for (const name of Object.values(ARCHIVE_FILES)) {
    if (name !== ARCHIVE_FILES.manifest && !(name in parsed.data.files)) throw new ArchiveRefused(`${ARCHIVE_FILES.manifest} does not list ${name}`);
  }
  for (const [name, hash] of Object.entries(parsed.data.files)) {
    const bytes = files.get(name);
    if (!bytes) throw new ArchiveRefused(`${name} is missing from the archive`);
    if (sha256(bytes) !== hash) throw new ArchiveRefused(`${name} does not match its checksum`);
  }
  return parsed.data;
}

/** Same data whatever the key order: then the archive's own text is kept byte for byte. */
function canonical(v: unknown): string {
  if (Array.isArray(v)) return `[${v.map(canonical).join(',')}]`;
  if (v && typeof v === 'object') {
    const entries = Object.entries(v as Record<string, unknown>).filter(([, x]) => x !== undefined).sort(([a], [b]) => a.localeCompare(b));
    return `{${entries.map(([k, x]) => `${JSON.stringify(k)}:${canonical(x)}`).join(',')}}`;
  }
  return JSON.stringify(v);
}
/** The JSON to store: the archive's as written when validation changed nothing, else the cleaned value. */
export const storedJson = (raw: unknown, parsed: unknown) => JSON.stringify(canonical(raw) === canonical(parsed) ? raw : parsed);

interface Checked<T> {
  record: T;
  raw: Record<string, unknown>;
}

/** Validates each record of one file; refusals are reported, never thrown. */
function checkAll<S extends z.ZodType>(files: Map<string, Uint8Array>, name: string, kind: ImportKind, schema: S, refused: ImportNote[]): Checked<z.infer<S>>[] {
  const list = readJson(files, name);
  if (!Array.isArray(list)) throw new ArchiveRefused(`${name} must hold a list of records`);
  const seen = new Set<number>();
  const out: Checked<z.infer<S>>[] = [];
  list.forEach((raw: unknown, index) => {
    const rawId = raw && typeof raw === 'object' && typeof (raw as { id?: unknown }).id === 'number' ? (raw as { id: number }).id : null;
    const result = schema.safeParse(raw);
    if (!result.success) {
      const reason = result.error.issues.map((i) => `${i.path.join('.') || 'record'}: ${i.message}`).join('; ');
      refused.push({ kind, id: rawId, reason: `${name} entry ${index + 1}: ${reason}` });
      return;
    }
    const key = rawId ?? -index - 1;
    if (seen.has(key)) {
      refused.push({ kind, id: rawId, reason: `${name}: id ${rawId} appears more than once` });
      return;
    }
    seen.add(key);
    out.push({ record: result.data, raw: raw as Record<string, unknown> });
  });
  return out;
}

export interface ArchiveRecords {
  manifest: ArchiveManifest;
  users: ArchivedUser[];
  cases: Checked<ArchivedCase>[];
  revisions: Checked<ArchivedRevision>[];
  comments: ArchivedComment[];
  attachments: (ArchivedAttachment & { bytes: Uint8Array; thumbnailBytes: Uint8Array | null })[];
  history: ArchivedHistory[];
  pins: { caseId: number; position: number }[];
  refused: ImportNote[];
}

function attachmentProblem(a: ArchivedAttachment, files: Map<string, Uint8Array>): string | null {
  const bytes = files.get(a.file);
  if (!bytes) return `its file ${a.file} is missing from the archive`;
  if (bytes.length !== a.sizeBytes) return `its file is ${bytes.length} bytes, the record says ${a.sizeBytes}`;
  if (sha256(bytes) !== a.sha256) return `its file ${a.file} does not match its checksum`;
  if (a.thumbnail && !files.has(a.thumbnail)) return `its thumbnail ${a.thumbnail} is missing from the archive`;
  const format = sniffImage(Buffer.from(bytes.subarray(0, 64)));
  if (a.kind === 'screenshot' && `image/${format}` !== a.contentType) return `its file is not the ${a.contentType} image the record says`;
  if (a.kind === 'capture' && format) return 'its file is an image, not a CSV capture';
  return null;
}

/** Every record of a verified archive, validated with the shared schemas. */
export function readArchive(files: Map<string, Uint8Array>): ArchiveRecords {
  const manifest = verifiedManifest(files);
  const refused: ImportNote[] = [];
  const users = checkAll(files, ARCHIVE_FILES.users, 'user', archivedUserSchema, refused).map((c) => c.record);
  const cases = checkAll(files, ARCHIVE_FILES.cases, 'case', archivedCaseSchema, refused);
  const revisions = checkAll(files, ARCHIVE_FILES.revisions, 'revision', archivedRevisionSchema, refused);
  const comments = checkAll(files, ARCHIVE_FILES.comments, 'comment', archivedCommentSchema, refused).map((c) => c.record);
  const attachments = checkAll(files, ARCHIVE_FILES.attachments, 'attachment', archivedAttachmentSchema, refused).flatMap(({ record: a }) => {
    const problem = attachmentProblem(a, files);
    if (problem) {
      refused.push({ kind: 'attachment', id: a.id, reason: problem });
      return [];
    }
    return [{ ...a, bytes: files.get(a.file)!, thumbnailBytes: a.thumbnail ? files.get(a.thumbnail)! : null }];
  });
  const history = checkAll(files, ARCHIVE_FILES.history, 'history', archivedHistorySchema, refused).map((c) => c.record);
  const pins = checkAll(files, ARCHIVE_FILES.pinned, 'pin', archivedPinSchema, refused).map((c) => c.record);
  return { manifest, users, cases, revisions, comments, attachments, history, pins, refused };
}
