import { createHash, randomUUID } from 'node:crypto';
import path from 'node:path';
import type { Actor } from '../../shared/auth/roles';
import type { CaseSetup, CaseStatus, StatedCause } from '../../shared/schemas/case';
import {
  ARCHIVE_FILES,
  ARCHIVE_FORMAT,
  ARCHIVE_VERSION,
  type ArchiveManifest,
  type ArchivedAttachment,
  type ArchivedCase,
  type ArchivedComment,
  type ArchivedHistory,
  type ArchivedRevision,
  type ArchivedUser,
  type CasebookExportQuery,
} from '../../shared/schemas/casebook-archive';
import { caseMarkdown } from '../casebook/case-markdown';
import { caseOriginKey } from '../casebook/origin-key';
import { zipWorkers, type ZipEntrySource } from '../casebook/zip-pool';
import {
  attachmentsOfCases,
  authorTagsOfCases,
  casesWithIds,
  commentsOfCases,
  historyOfCases,
  pinsOfCases,
  revisionsOfCases,
  usersWithIds,
} from '../db/repositories/casebook';
import { listCases } from '../db/repositories/cases';
import type { AppDeps } from '../deps';
import { storagePaths } from '../storage';

const sha256 = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex');
const json = (value: unknown) => Buffer.from(`${JSON.stringify(value, null, 2)}\n`);
const parse = (text: string | null) => (text === null ? null : (JSON.parse(text) as unknown));

/** A folder name people can read: `0007-buck-switch-node-rings-at-110-mhz`. */
export function caseFolder(id: number, title: string): string {
  const slug = title
    .normalize('NFKD')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-|-$/g, '')
    .slice(0, 48)
    .replace(/-$/, '');
  return `cases/${String(id).padStart(4, '0')}-${slug || 'case'}`;
}

/** Records grouped by their case (thousands of cases would otherwise rescan every list per case). */
function byCase<T extends { caseId: number }>(list: T[]): Map<number, T[]> {
  const g = new Map<number, T[]>();
  for (const x of list) {
    const l = g.get(x.caseId);
    if (l) l.push(x);
    else g.set(x.caseId, [x]);
  }
  return g;
}

const safeName = (name: string) => name.replace(/[^\w.-]+/g, '_').slice(0, 120) || 'file';

/** Ids of every case matching the filters that the actor may see, oldest first. */
async function matchingCaseIds(deps: AppDeps, actor: Actor, filters: CasebookExportQuery): Promise<number[]> {
  const ids: number[] = [];
  for (let page = 1; ; page++) {
    const { rows } = await listCases(deps.db, actor, { ...filters, page, pageSize: 100, sort: 'createdAt' });
    ids.push(...rows.map((r) => r.id));
    if (rows.length < 100) return ids;
  }
}

export interface CasebookExport {
  /** The zip, written to a temporary file the caller streams out and then removes. */
  file: string;
  filename: string;
  cases: number;
}

/**
 * The casebook (or the part the filters select) as a zip: JSON records for import, one
 * Markdown page per case with its attachments for reading, and a manifest with checksums.
 */
export async function exportCasebook(deps: AppDeps, actor: Actor, filters: CasebookExportQuery, now = new Date()): Promise<CasebookExport> {
  const { db } = deps;
  const storage = storagePaths(deps.config);
  const ids = await matchingCaseIds(deps, actor, filters);
  const rows = await casesWithIds(db, ids);
  const tags = new Map<number, string[]>();
  for (const t of await authorTagsOfCases(db, ids)) tags.set(t.case_id, [...(tags.get(t.case_id) ?? []), t.tag]);

  const cases: ArchivedCase[] = rows.map((r) => ({
    id: r.id,
    authorId: r.author_id,
    title: r.title,
    summary: r.summary,
    narrative: r.narrative,
    setup: JSON.parse(r.setup) as CaseSetup,
    statedCause: r.stated_cause as StatedCause | null,
    statedCauseOther: r.stated_cause_other,
    fix: r.fix,
    lessonSummary: r.lesson_summary,
    lessonDetail: r.lesson_detail,
    safetyNote: r.safety_note ?? null,
    tags: tags.get(r.id) ?? [],
    status: r.status as CaseStatus,
    reviewNote: r.review_note,
    duplicateOf: r.duplicate_of,
    retiredReason: r.retired_reason,
    createdAt: r.created_at,
    updatedAt: r.updated_at,
    submittedAt: r.submitted_at,
    verifiedAt: r.verified_at,
  }));
  const revisions: ArchivedRevision[] = (await revisionsOfCases(db, ids)).map((r) => ({
    id: r.id,
    caseId: r.case_id,
    number: r.number,
    authorId: r.author_id,
    snapshot: JSON.parse(r.snapshot),
    createdAt: r.created_at,
  }));
  const comments: ArchivedComment[] = (await commentsOfCases(db, ids)).map((r) => ({
    id: r.id,
    caseId: r.case_id,
    authorId: r.author_id,
    body: r.body,
    hidden: r.hidden === 1,
    hiddenBy: r.hidden_by,
    createdAt: r.created_at,
    updatedAt: r.updated_at,
  }));
  const history: ArchivedHistory[] = (await historyOfCases(db, ids)).map((r) => ({
    id: r.id,
    caseId: r.case_id!,
    actorId: r.actor_id,
    action: r.action,
    before: parse(r.before),
    after: parse(r.after),
    note: r.note,
    createdAt: r.created_at,
  }));
  const pins = (await pinsOfCases(db, ids)).map((p) => ({ caseId: p.case_id, position: p.position }));

  // the zip's entries in order, and each one's SHA-256 for the manifest; attachments stay on disk
  const entries: ZipEntrySource[] = [];
  const hashes = new Map<string, string>();
  const addBytes = (name: string, bytes: Uint8Array) => {
    entries.push({ name, bytes });
    hashes.set(name, sha256(bytes));
  };
  const folders = new Map(rows.map((r) => [r.id, caseFolder(r.id, r.title)]));
  const attachments: (ArchivedAttachment & { localPath: string })[] = [];
  const attachmentRows = await attachmentsOfCases(db, ids);
  const onDisk = attachmentRows.flatMap((a) => [a.storage_name, ...(a.thumbnail_name ? [a.thumbnail_name] : [])]).map((n) => storage.fileFor(n));
  const digests = new Map((await zipWorkers.hash(onDisk)).map((h, i) => [onDisk[i], h]));
  const addFile = (name: string, storageName: string) => {
    const file = storage.fileFor(storageName);
    entries.push({ name, file });
    hashes.set(name, digests.get(file)!);
  };
  for (const a of attachmentRows) {
    const folder = folders.get(a.case_id)!;
    const file = `${folder}/attachments/${a.id}-${safeName(a.original_name)}`;
    addFile(file, a.storage_name);
    let thumbnail: string | null = null;
    if (a.thumbnail_name) {
      thumbnail = `${folder}/attachments/thumbnails/${a.id}-${safeName(a.original_name)}`;
      addFile(thumbnail, a.thumbnail_name);
    }
    attachments.push({
      id: a.id,
      caseId: a.case_id,
      uploadedBy: a.uploaded_by,
      kind: a.kind,
      originalName: a.original_name,
      contentType: a.content_type as ArchivedAttachment['contentType'],
      sizeBytes: a.size_bytes,
      width: a.width,
      height: a.height,
      analysis: parse(a.analysis) as Record<string, unknown> | null,
      createdAt: a.created_at,
      file,
      sha256: hashes.get(file)!,
      thumbnail,
      localPath: file.slice(folder.length + 1),
    });
  }

  const userIds = new Set<number>();
  for (const c of cases) userIds.add(c.authorId);
  for (const r of revisions) if (r.authorId) userIds.add(r.authorId);
  for (const m of comments) [m.authorId, m.hiddenBy].forEach((u) => u && userIds.add(u));
  for (const a of attachments) if (a.uploadedBy) userIds.add(a.uploadedBy);
  for (const h of history) if (h.actorId) userIds.add(h.actorId);
  const users: ArchivedUser[] = await usersWithIds(db, [...userIds].sort((a, b) => a - b));
  const names = new Map(users.map((u) => [u.id, u.name]));
  // the case's origin travels with it, so importing it anywhere twice is recognised
  const emails = new Map(users.map((u) => [u.id, u.email]));
  const rowById = new Map(rows.map((r) => [r.id, r]));
  for (const c of cases) {
    const row = rowById.get(c.id)!;
    c.originKey = row.origin_key ?? caseOriginKey(emails.get(c.authorId)!, row.created_at);
  }
  const userName = (id: number | null) => (id === null ? 'former member' : (names.get(id) ?? 'former member'));

  const [commentsOf, attachmentsOf, historyOf] = [byCase(comments), byCase(attachments), byCase(history)];
  for (const c of cases) {
    const row = rowById.get(c.id)!;
    addBytes(
      `${folders.get(c.id)!}/case.md`,
      Buffer.from(
        caseMarkdown({
          c,
          engineCause: row.engine_cause,
          authorName: userName(c.authorId),
          userName,
          comments: commentsOf.get(c.id) ?? [],
          attachments: attachmentsOf.get(c.id) ?? [],
          history: historyOf.get(c.id) ?? [],
        }),
      ),
    );
  }
  addBytes(ARCHIVE_FILES.users, json(users));
  addBytes(ARCHIVE_FILES.cases, json(cases));
  addBytes(ARCHIVE_FILES.revisions, json(revisions));
  addBytes(ARCHIVE_FILES.comments, json(comments));
  addBytes(ARCHIVE_FILES.attachments, json(attachments.map(({ localPath: _l, ...a }) => a)));
  addBytes(ARCHIVE_FILES.history, json(history));
  addBytes(ARCHIVE_FILES.pinned, json(pins));
  addBytes(
    'README.md',
    Buffer.from(
      `# Falsetrace casebook\n\nExported ${now.toISOString()} with ${cases.length} case${cases.length === 1 ? '' : 's'}.\n\n` +
        'Each case has a folder under `cases/` with `case.md` and its attachments. The JSON files hold the same records for\n' +
        'import into another Falsetrace (People → Casebook → Import); `casebook.json` lists a SHA-256 of every file.\n',
    ),
  );
  const manifest: ArchiveManifest = {
    format: ARCHIVE_FORMAT,
    version: ARCHIVE_VERSION,
    exportedAt: now.toISOString(),
    filters: Object.fromEntries(Object.entries(filters).filter(([, v]) => v !== undefined).map(([k, v]) => [k, String(v)])),
    files: Object.fromEntries(hashes),
  };
  addBytes(ARCHIVE_FILES.manifest, json(manifest));
  // packed off the request thread, streamed from disk entry by entry, never whole in memory
  const file = path.join(storage.incomingDir, `export-${randomUUID()}.zip`);
  await zipWorkers.pack(file, entries);
  return { file, filename: `falsetrace-casebook-${now.toISOString().slice(0, 10)}.zip`, cases: cases.length };
}
