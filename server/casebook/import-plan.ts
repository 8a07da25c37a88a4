import { open, readFile } from 'node:fs/promises';
import path from 'node:path';
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

/** An archive unpacked to a folder: each file's size and SHA-256 as measured while unpacking. */
export interface UnpackedArchive {
  dir: string;
  files: Map<string, { bytes: number; sha256: string }>;
}

const fileOf = (u: UnpackedArchive, name: string) => path.join(u.dir, name);

async function readJson(u: UnpackedArchive, name: string): Promise<unknown> {
  if (!u.files.has(name)) throw new ArchiveRefused(`${name} is missing from the archive`);
  try {
    return JSON.parse(await readFile(fileOf(u, name), 'utf8'));
  } catch {
    throw new ArchiveRefused(`${name} is not valid JSON`);
  }
}

/** The first bytes of an unpacked file, enough to tell an image format. */
async function headOf(file: string): Promise<Buffer> {
  const fh = await open(file, 'r');
  try {
    const head = Buffer.alloc(64);
    const { bytesRead } = await fh.read(head, 0, 64, 0);
    return head.subarray(0, bytesRead);
  } finally {
    await fh.close();
  }
}

/** The manifest, after checking that every file it lists is present and unchanged. */
export async function verifiedManifest(u: UnpackedArchive): Promise<ArchiveManifest> {
  const parsed = archiveManifestSchema.safeParse(await readJson(u, ARCHIVE_FILES.manifest));
  if (!parsed.success) {
    const i = parsed.error.issues[0];
    throw new ArchiveRefused(`${ARCHIVE_FILES.manifest} ${i.path.length ? `${i.path.join('.')} ` : ''}${i.message}`);
  }
  for (const name of Object.values(ARCHIVE_FILES)) {
    if (name !== ARCHIVE_FILES.manifest && !(name in parsed.data.files)) throw new ArchiveRefused(`${ARCHIVE_FILES.manifest} does not list ${name}`);
  }
  for (const [name, hash] of Object.entries(parsed.data.files)) {
    const file = u.files.get(name);
    if (!file) throw new ArchiveRefused(`${name} is missing from the archive`);
    if (file.sha256 !== hash) throw new ArchiveRefused(`${name} does not match its checksum`);
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
async function checkAll<S extends z.ZodType>(u: UnpackedArchive, name: string, kind: ImportKind, schema: S, refused: ImportNote[]): Promise<Checked<z.infer<S>>[]> {
  const list = await readJson(u, name);
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
  /** `path`: the attachment's file, unpacked and checked. */
  attachments: (ArchivedAttachment & { path: string })[];
  history: ArchivedHistory[];
  pins: { caseId: number; position: number }[];
  refused: ImportNote[];
}

async function attachmentProblem(a: ArchivedAttachment, u: UnpackedArchive): Promise<string | null> {
  const file = u.files.get(a.file);
  if (!file) return `its file ${a.file} is missing from the archive`;
  if (file.bytes !== a.sizeBytes) return `its file is ${file.bytes} bytes, the record says ${a.sizeBytes}`;
  if (file.sha256 !== a.sha256) return `its file ${a.file} does not match its checksum`;
  if (a.thumbnail && !u.files.has(a.thumbnail)) return `its thumbnail ${a.thumbnail} is missing from the archive`;
  const format = sniffImage(await headOf(fileOf(u, a.file)));
  if (a.kind === 'screenshot' && `image/${format}` !== a.contentType) return `its file is not the ${a.contentType} image the record says`;
  if (a.kind === 'capture' && format) return 'its file is an image, not a CSV capture';
  return null;
}

/** Every record of a verified archive, validated with the shared schemas. */
export async function readArchive(u: UnpackedArchive): Promise<ArchiveRecords> {
  const manifest = await verifiedManifest(u);
  const refused: ImportNote[] = [];
  const users = (await checkAll(u, ARCHIVE_FILES.users, 'user', archivedUserSchema, refused)).map((c) => c.record);
  const cases = await checkAll(u, ARCHIVE_FILES.cases, 'case', archivedCaseSchema, refused);
  const revisions = await checkAll(u, ARCHIVE_FILES.revisions, 'revision', archivedRevisionSchema, refused);
  const comments = (await checkAll(u, ARCHIVE_FILES.comments, 'comment', archivedCommentSchema, refused)).map((c) => c.record);
  const attachments: ArchiveRecords['attachments'] = [];
  for (const { record: a } of await checkAll(u, ARCHIVE_FILES.attachments, 'attachment', archivedAttachmentSchema, refused)) {
    const problem = await attachmentProblem(a, u);
    if (problem) refused.push({ kind: 'attachment', id: a.id, reason: problem });
    else attachments.push({ ...a, path: fileOf(u, a.file) });
  }
  const history = (await checkAll(u, ARCHIVE_FILES.history, 'history', archivedHistorySchema, refused)).map((c) => c.record);
  const pins = (await checkAll(u, ARCHIVE_FILES.pinned, 'pin', archivedPinSchema, refused)).map((c) => c.record);
  return { manifest, users, cases, revisions, comments, attachments, history, pins, refused };
}
