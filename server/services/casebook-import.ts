import { readFile } from 'node:fs/promises';
import type { Actor } from '../../shared/auth/roles';
import type { CasebookImportReport, ImportKind, ImportNote } from '../../shared/schemas/casebook-archive';
import { readArchive, storedJson, ArchiveRefused, type ArchiveRecords } from '../casebook/import-plan';
import { unpackArchive } from '../casebook/unpack-archive';
import { caseOriginKey } from '../casebook/origin-key';
import {
  appendPinnedLesson,
  casesWithOriginKeys,
  insertImportedAttachment,
  insertImportedCase,
  insertImportedComment,
  insertImportedHistory,
  insertImportedRevision,
  insertImportedTags,
  insertImportedUser,
  linkImportedDuplicate,
  lockWriters,
  localCasesCreatedAt,
  updateImportedWriteUp,
  usersByEmail,
} from '../db/repositories/casebook';
import type { AppDeps } from '../deps';
import { refreshPlannerStatistics } from '../db/dialect';
import { AppError } from '../errors';
import { storagePaths } from '../storage';
import { diagnosisColumns, recomputeDiagnosis } from './case-diagnosis';
import { MAX_IMAGE_PIXELS, reencodeImage, sniffImage } from './image-intake';
import { allCasesChanged } from '../search/change-log';
import { renumberCaseReferences } from '../../shared/cases/case-references';
import { recordCommentReferences, recordWriteUpReferences } from './case-references';

type Records = ArchiveRecords;
type Db = AppDeps['db'];

/** Archive case id → the id of the same case already in this casebook (matched by origin key, never by number). */
async function casesAlreadyHere(db: Db, keyOf: Map<number, string>, createdAt: Map<number, string>): Promise<Map<number, number>> {
  const localByKey = await casesWithOriginKeys(db, [...new Set(keyOf.values())]);
  for (const row of await localCasesCreatedAt(db, [...new Set(createdAt.values())])) {
    const key = caseOriginKey(row.email, row.created_at);
    if (!localByKey.has(key)) localByKey.set(key, row.id);
  }
  const here = new Map<number, number>();
  for (const [archiveId, key] of keyOf) {
    const local = localByKey.get(key);
    if (local !== undefined) here.set(archiveId, local);
  }
  return here;
}

/**
 * Which archived records go in, which are already here, and who is who in this database. `only`
 * narrows the cases to those a first look chose (their files are prepared outside the transaction).
 */
async function decide(db: Db, r: Records, only?: ReadonlySet<number>) {
  const skipped: ImportNote[] = [];
  const refused: ImportNote[] = [...r.refused];
  const notes: string[] = [];
  const refuse = (kind: ImportKind, id: number | null, reason: string) => refused.push({ kind, id, reason });
  const skip = (kind: ImportKind, id: number | null, reason: string) => skipped.push({ kind, id, reason });

  const knownUsers = new Map(r.users.map((u) => [u.id, u]));
  const localByEmail = await usersByEmail(db, r.users.map((u) => u.email));
  const keyOf = new Map<number, string>();
  const createdAt = new Map<number, string>();
  for (const { record: c } of r.cases) {
    const author = knownUsers.get(c.authorId);
    if (author) keyOf.set(c.id, c.originKey ?? caseOriginKey(author.email, c.createdAt));
    createdAt.set(c.id, c.createdAt);
  }
  const here = await casesAlreadyHere(db, keyOf, createdAt);
  const firstWithKey = new Map<string, number>();
  const cases = r.cases.filter(({ record: c }) => {
    const key = keyOf.get(c.id);
    if (key === undefined) return refuse('case', c.id, `its author (user ${c.authorId}) is not in users.json`), false;
    if (here.has(c.id)) return skip('case', c.id, `case #${c.id} of the archive is already in this casebook as #${here.get(c.id)}`), false;
    if (firstWithKey.has(key)) return refuse('case', c.id, `it is the same case as #${firstWithKey.get(key)} of the archive (same origin)`), false;
    firstWithKey.set(key, c.id);
    if (only && !only.has(c.id)) return skip('case', c.id, `case #${c.id} changed in this casebook while importing`), false;
    return true;
  });
  const incoming = new Set(cases.map((c) => c.record.id));
  for (const { record: c } of cases) {
    if (c.duplicateOf && !incoming.has(c.duplicateOf) && !here.has(c.duplicateOf)) {
      notes.push(`Case #${c.id} named #${c.duplicateOf} as its original, which is neither in the archive nor already here; the link was dropped.`);
      c.duplicateOf = null;
    }
  }

  /** A child record goes in only with its case; one whose case is already here is skipped with it. */
  const withCase = <T extends { id?: number; caseId: number }>(kind: ImportKind, list: T[]) =>
    list.filter((x) => {
      const id = x.id ?? null;
      if (here.has(x.caseId)) return skip(kind, id, `its case #${x.caseId} is already in this casebook`), false;
      if (!incoming.has(x.caseId)) return refuse(kind, id, `its case #${x.caseId} was not imported`), false;
      return true;
    });
  const revisions = withCase('revision', r.revisions.map((x) => ({ ...x, id: x.record.id, caseId: x.record.caseId })));
  const comments = withCase('comment', r.comments).filter((m) =>
    knownUsers.has(m.authorId) ? true : (refuse('comment', m.id, `its author (user ${m.authorId}) is not in users.json`), false),
  );
  const attachments = withCase('attachment', r.attachments);
  const history = withCase('history', r.history);
  const verified = new Set(cases.filter((c) => c.record.status === 'verified').map((c) => c.record.id));
  const pins = r.pins.filter((p) => incoming.has(p.caseId) && verified.has(p.caseId));

  // everyone an imported record names keeps their name here, even if they only edited or reviewed
  const referenced = new Set<number>();
  cases.forEach((c) => referenced.add(c.record.authorId));
  revisions.forEach((v) => v.record.authorId && referenced.add(v.record.authorId));
  comments.forEach((m) => [m.authorId, m.hiddenBy].forEach((u) => u && referenced.add(u)));
  attachments.forEach((a) => a.uploadedBy && referenced.add(a.uploadedBy));
  history.forEach((h) => h.actorId && referenced.add(h.actorId));
  const newUsers = r.users.filter((u) => referenced.has(u.id) && !localByEmail.has(u.email));
  if (newUsers.length) {
    notes.push(`${newUsers.length} account${newUsers.length === 1 ? '' : 's'} created for people not in this casebook yet, deactivated and with the engineer role until an admin decides: ${newUsers.map((u) => u.email).join(', ')}.`);
  }
  return { cases, revisions, comments, attachments, history, pins, newUsers, knownUsers, localByEmail, here, keyOf, skipped, refused, notes };
}

/** "#12" in a text the review wrote about the original, renumbered to the original's id here. */
const renumbered = (text: string | null, from: number | null, to: number | undefined) =>
  text === null || from === null || to === undefined ? text : text.replace(new RegExp(`#${from}(?!\\d)`, 'g'), `#${to}`);

/** A history entry's before/after with the original's archive number replaced by its id here. */
function renumberedState(v: unknown, caseId: (n: number) => number | undefined): unknown {
  if (!v || typeof v !== 'object' || Array.isArray(v)) return v;
  const o = v as Record<string, unknown>;
  if (typeof o.duplicateOf !== 'number') return v;
  const to = caseId(o.duplicateOf);
  return to === undefined ? Object.fromEntries(Object.entries(o).filter(([k]) => k !== 'duplicateOf')) : { ...o, duplicateOf: to };
}

/** What the import did or would do, in the archive's record numbers. */
function reportOf(d: Awaited<ReturnType<typeof decide>>, dryRun: boolean): CasebookImportReport {
  return {
    dryRun,
    imported: {
      users: d.newUsers.length,
      cases: d.cases.length,
      revisions: d.revisions.length,
      comments: d.comments.length,
      attachments: d.attachments.length,
      history: d.history.length,
      pins: d.pins.length,
    },
    skipped: d.skipped,
    refused: d.refused,
    notes: d.notes,
  };
}

interface StoredFile {
  file: string;
  thumbnail: string | null;
  sizeBytes: number;
  width: number | null;
  height: number | null;
  contentType: string;
}

/** Re-encodes screenshots exactly like uploads and writes every attachment's file; the names written go into `written`. */
async function storeFiles(deps: AppDeps, attachments: Records['attachments'], written: string[]): Promise<Map<number, StoredFile>> {
  const storage = storagePaths(deps.config);
  const stored = new Map<number, StoredFile>();
  for (const a of attachments) {
    if (a.kind === 'screenshot') {
      // decoded and re-encoded exactly like an upload: header check, worker, no metadata kept
      // one screenshot in memory at a time
      const bytes = await readFile(a.path);
      const format = sniffImage(bytes.subarray(0, 64));
      const img = format ? await reencodeImage(bytes, format) : null;
      if (img === null) throw new AppError('unsupported_type', `Attachment ${a.id} (“${a.originalName}”) does not decode as an image; nothing was imported`);
      if (img === 'too_many_pixels') throw new AppError('too_large', `Attachment ${a.id} (“${a.originalName}”) has over ${MAX_IMAGE_PIXELS / 1e6} megapixels; nothing was imported`);
      const file = storage.newName(img.extension);
      const thumbnail = storage.newName(img.extension).replace(/(\.\w+)$/, '.thumb$1');
      await storage.write(file, img.image);
      written.push(file);
      await storage.write(thumbnail, img.thumbnail);
      written.push(thumbnail);
      stored.set(a.id, { file, thumbnail, sizeBytes: img.image.length, width: img.width, height: img.height, contentType: img.contentType });
      continue;
    }
    const file = storage.newName('csv');
    await storage.copyIn(a.path, file);
    written.push(file);
    stored.set(a.id, { file, thumbnail: null, sizeBytes: a.sizeBytes, width: a.width, height: a.height, contentType: a.contentType });
  }
  return stored;
}

/** Writes the decided records with fresh ids, mapping every archive number it names to the new one. */
async function insertRecords(trx: Db, d: Awaited<ReturnType<typeof decide>>, stored: Map<number, StoredFile>, actor: Actor, exportedAt: string, now: string) {
  const localId = new Map<number, number>();
  for (const u of d.knownUsers.values()) {
    const here = d.localByEmail.get(u.email);
    if (here) localId.set(u.id, here);
  }
  for (const u of d.newUsers) {
    localId.set(u.id, await insertImportedUser(trx, { email: u.email, name: u.name, role: 'engineer', password_hash: null, active: 0, created_at: now, updated_at: now }));
  }
  const user = (id: number | null) => (id === null ? null : (localId.get(id) ?? null));
  // cases already here keep their ids; the imported ones get new ones as they go in
  const caseIds = new Map(d.here);
  const caseId = (archiveId: number) => caseIds.get(archiveId);
  for (const { record: c, raw } of d.cases) {
    const diagnosis = recomputeDiagnosis(c.setup, c.statedCause);
    const id = await insertImportedCase(trx, {
      author_id: user(c.authorId)!,
      title: c.title,
      summary: c.summary,
      narrative: c.narrative,
      setup: storedJson(raw.setup, c.setup),
      stated_cause: c.statedCause,
      stated_cause_other: c.statedCauseOther ?? null,
      fix: c.fix ?? null,
      lesson_summary: c.lessonSummary ?? null,
      lesson_detail: c.lessonDetail ?? null,
      safety_note: c.safetyNote ?? null,
      origin_key: d.keyOf.get(c.id)!,
      status: c.status,
      ...diagnosisColumns(diagnosis),
      review_note: c.reviewNote,
      duplicate_of: null,
      retired_reason: c.retiredReason,
      created_at: c.createdAt,
      updated_at: c.updatedAt,
      submitted_at: c.submittedAt,
      verified_at: c.verifiedAt,
    });
    caseIds.set(c.id, id);
    await insertImportedTags(trx, id, c.tags, 'author');
    await insertImportedTags(trx, id, diagnosis.engineTags.filter((t) => !c.tags.includes(t)), 'engine');
  }
  // links between cases are set once every case has its id here
  for (const { record: c } of d.cases) {
    if (!c.duplicateOf) continue;
    const id = caseId(c.id)!;
    await linkImportedDuplicate(trx, id, caseId(c.duplicateOf)!, renumbered(c.retiredReason, c.duplicateOf, caseId(c.duplicateOf)));
  }
  for (const { record: v, raw } of d.revisions) {
    await insertImportedRevision(trx, { case_id: caseId(v.caseId)!, number: v.number, author_id: user(v.authorId), snapshot: storedJson(raw.snapshot, v.snapshot), created_at: v.createdAt });
  }
  // `#123` in the write-ups and comments named the archive's cases: renumbered to the ids here, and the links recorded
  const unlinked = new Set<number>();
  const renumber = (text: string | null) => {
    if (text === null) return null;
    const r = renumberCaseReferences(text, caseId);
    r.unmatched.forEach((n) => unlinked.add(n));
    return r.text;
  };
  for (const { record: c } of d.cases) {
    const id = caseId(c.id)!;
    const narrative = renumber(c.narrative);
    const lessonDetail = renumber(c.lessonDetail ?? null);
    if (narrative !== c.narrative || lessonDetail !== (c.lessonDetail ?? null)) await updateImportedWriteUp(trx, id, narrative ?? '', lessonDetail);
    await recordWriteUpReferences(trx, id, narrative, lessonDetail);
  }
  for (const m of d.comments) {
    const body = renumber(m.body)!;
    const commentId = await insertImportedComment(trx, { case_id: caseId(m.caseId)!, author_id: user(m.authorId)!, body, hidden: m.hidden ? 1 : 0, hidden_by: user(m.hiddenBy), created_at: m.createdAt, updated_at: m.updatedAt });
    if (!m.hidden) await recordCommentReferences(trx, caseId(m.caseId)!, commentId, body);
  }
  if (unlinked.size) {
    const list = [...unlinked].sort((a, b) => a - b).map((n) => `#${n}`).join(', ');
    d.notes.push(`The imported texts named case${unlinked.size === 1 ? '' : 's'} ${list} of the archive, which ${unlinked.size === 1 ? 'is' : 'are'} neither in it nor already here; written as “archive case N”, not as links.`);
  }
  for (const a of d.attachments) {
    const s = stored.get(a.id)!;
    await insertImportedAttachment(trx, {
      case_id: caseId(a.caseId)!,
      uploaded_by: user(a.uploadedBy),
      kind: a.kind,
      storage_name: s.file,
      thumbnail_name: s.thumbnail,
      original_name: a.originalName,
      content_type: s.contentType,
      size_bytes: s.sizeBytes,
      width: s.width,
      height: s.height,
      analysis: a.analysis === null ? null : JSON.stringify(a.analysis),
      created_at: a.createdAt,
    });
  }
  const text = (v: unknown) => (v === null || v === undefined ? null : JSON.stringify(v));
  for (const h of d.history) {
    const before = renumberedState(h.before, caseId);
    const after = renumberedState(h.after, caseId);
    const original = (h.after as { duplicateOf?: unknown } | null)?.duplicateOf;
    const note = typeof original === 'number' ? renumbered(h.note, original, caseId(original)) : h.note;
    await insertImportedHistory(trx, { case_id: caseId(h.caseId)!, actor_id: user(h.actorId), action: h.action, before: text(before), after: text(after), note, created_at: h.createdAt });
  }
  for (const { record: c } of d.cases) {
    const note = `Imported from a casebook archive exported ${exportedAt}, where it was case #${c.id}`;
    await insertImportedHistory(trx, { case_id: caseId(c.id)!, actor_id: actor.id, action: 'import', before: null, after: null, note, created_at: now });
  }
  for (const p of [...d.pins].sort((a, b) => a.position - b.position)) await appendPinnedLesson(trx, caseId(p.caseId)!, actor.id, now);
}

/**
 * Imports a casebook archive (as exported by `exportCasebook`). The archive is refused whole when
 * it is not one, or any file in it is damaged; otherwise every record is validated, cases already
 * here (same origin key, never the same number) are skipped, invalid ones are refused with the
 * reason, and the rest go in with new ids within one transaction: all of it or, on any failure,
 * nothing. The transaction holds the database's only connection, so no other write interleaves
 * between deciding what is already here and writing.
 */
export async function importCasebook(
  deps: AppDeps,
  actor: Actor,
  archive: string,
  options: { dryRun?: boolean; limits?: { maxEntries: number; maxBytes: number } } = {},
): Promise<CasebookImportReport> {
  const { unpacked, discard } = await unpackArchive(archive, storagePaths(deps.config).incomingDir, options.limits);
  try {
    if (!unpacked.ok) {
      if (unpacked.tooLarge) throw new AppError('too_large', `This archive is refused: ${unpacked.message}. Nothing was unpacked or imported.`);
      throw new AppError('unsupported_type', `This is not a casebook archive Falsetrace can read: ${unpacked.message}. Nothing was imported.`);
    }
    let records: Records;
    try {
      records = await readArchive(unpacked);
    } catch (err) {
      if (err instanceof ArchiveRefused) throw new AppError('invalid_input', `The archive is damaged or incomplete: ${err.message}. Nothing was imported.`);
      throw err;
    }
    return await importRecords(deps, actor, records, Boolean(options.dryRun));
  } finally {
    await discard();
  }
}

async function importRecords(deps: AppDeps, actor: Actor, records: Records, dryRun: boolean): Promise<CasebookImportReport> {
  const first = await decide(deps.db, records);
  if (dryRun || first.cases.length === 0) return reportOf(first, dryRun);

  const storage = storagePaths(deps.config);
  const written: string[] = [];
  const now = new Date().toISOString();
  const unused: string[] = [];
  let report: CasebookImportReport;
  try {
    // the slow part (decoding images, writing files) happens before the transaction, for the cases a first look chose
    const stored = await storeFiles(deps, first.attachments, written);
    report = await deps.db.transaction().execute(async (trx) => {
      await lockWriters(trx, 'casebook-import');
      const d = await decide(trx, records, new Set(first.cases.map((c) => c.record.id)));
      await insertRecords(trx, d, stored, actor, records.manifest.exportedAt, now);
      const used = new Set(d.attachments.map((a) => a.id));
      for (const [id, s] of stored) if (!used.has(id)) unused.push(s.file, ...(s.thumbnail ? [s.thumbnail] : []));
      return reportOf(d, false);
    });
  } catch (err) {
    await Promise.all(written.map((n) => storage.remove(n)));
    // a refused file keeps its own status (413, 415); anything else is a failed write
    if (err instanceof AppError) throw err;
    throw new AppError('conflict', `The import failed and nothing was imported: ${(err as Error).message}`);
  }
  // files of cases that turned out to be here already while importing are not kept
  await Promise.all(unused.map((n) => storage.remove(n)));
  // rows went in beside the services, so the search index reads them afresh
  await allCasesChanged(deps);
  await refreshPlannerStatistics(deps.db);
  return report;
}
