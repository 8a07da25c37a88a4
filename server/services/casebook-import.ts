import { writeFile } from 'node:fs/promises';
import type { Actor } from '../../shared/auth/roles';
import type { CasebookImportReport, ImportKind, ImportNote } from '../../shared/schemas/casebook-archive';
import { readArchive, storedJson, ArchiveRefused, type ArchiveRecords } from '../casebook/import-plan';
import { unzipFiles } from '../casebook/zip';
import {
  appendPinnedLesson,
  existingIds,
  insertImportedAttachment,
  insertImportedCase,
  insertImportedComment,
  insertImportedHistory,
  insertImportedRevision,
  insertImportedTags,
  insertImportedUser,
  linkImportedDuplicate,
  usersByEmail,
} from '../db/repositories/casebook';
import type { AppDeps } from '../deps';
import { AppError } from '../errors';
import { storagePaths } from '../storage';
import { recomputeDiagnosis } from './case-diagnosis';
import { MAX_IMAGE_PIXELS, reencodeImage, sniffImage } from './image-intake';

type Records = ArchiveRecords;

/** Which archived records go in, which are already here, and who is who in this database. */
async function decide(deps: AppDeps, r: Records) {
  const skipped: ImportNote[] = [];
  const refused: ImportNote[] = [...r.refused];
  const notes: string[] = [];
  const refuse = (kind: ImportKind, id: number | null, reason: string) => refused.push({ kind, id, reason });
  const skip = (kind: ImportKind, id: number | null, reason: string) => skipped.push({ kind, id, reason });

  const knownUsers = new Map(r.users.map((u) => [u.id, u]));
  const localByEmail = await usersByEmail(deps.db, r.users.map((u) => u.email));
  const hereCases = await existingIds(deps.db, 'cases', r.cases.map((c) => c.record.id));
  const cases = r.cases.filter(({ record: c }) => {
    if (!knownUsers.has(c.authorId)) return refuse('case', c.id, `its author (user ${c.authorId}) is not in users.json`), false;
    if (hereCases.has(c.id)) return skip('case', c.id, `case #${c.id} is already in this casebook`), false;
    return true;
  });
  const incoming = new Set(cases.map((c) => c.record.id));
  const skippedCases = new Set(r.cases.filter((c) => hereCases.has(c.record.id)).map((c) => c.record.id));
  for (const { record: c } of cases) {
    if (c.duplicateOf && !incoming.has(c.duplicateOf) && !hereCases.has(c.duplicateOf)) {
      notes.push(`Case #${c.id} named #${c.duplicateOf} as its original, which is in neither casebook; the link was dropped.`);
      c.duplicateOf = null;
    }
  }

  /** A child record goes in only with its case; one whose case is already here is skipped with it. */
  const withCase = <T extends { id?: number; caseId: number }>(kind: ImportKind, list: T[], here: Set<number>) =>
    list.filter((x) => {
      const id = x.id ?? null;
      if (skippedCases.has(x.caseId)) return skip(kind, id, `its case #${x.caseId} is already in this casebook`), false;
      if (!incoming.has(x.caseId)) return refuse(kind, id, `its case #${x.caseId} was not imported`), false;
      if (id !== null && here.has(id)) return skip(kind, id, `a ${kind} with id ${id} is already in this casebook`), false;
      return true;
    });
  const revisionIds = await existingIds(deps.db, 'case_revisions', r.revisions.map((x) => x.record.id));
  const revisions = withCase('revision', r.revisions.map((x) => ({ ...x, id: x.record.id, caseId: x.record.caseId })), revisionIds);
  const comments = withCase('comment', r.comments, await existingIds(deps.db, 'comments', r.comments.map((x) => x.id))).filter((m) =>
    knownUsers.has(m.authorId) ? true : (refuse('comment', m.id, `its author (user ${m.authorId}) is not in users.json`), false),
  );
  const attachments = withCase('attachment', r.attachments, await existingIds(deps.db, 'attachments', r.attachments.map((x) => x.id)));
  const history = withCase('history', r.history, new Set());
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
  return { cases, revisions, comments, attachments, history, pins, newUsers, knownUsers, localByEmail, skipped, refused, notes };
}

/**
 * Imports a casebook archive (as exported by `exportCasebook`). The archive is refused whole when
 * it is not one, or any file in it is damaged; otherwise every record is validated, records
 * already here (same id) are skipped, invalid ones are refused with the reason, and the rest go
 * in within one transaction: all of it or, on any failure, nothing.
 */
export async function importCasebook(deps: AppDeps, actor: Actor, zip: Uint8Array, options: { dryRun?: boolean } = {}): Promise<CasebookImportReport> {
  const unzipped = unzipFiles(zip);
  if (!unzipped.ok) throw new AppError('unsupported_type', `This is not a casebook archive Falsetrace can read: ${unzipped.message}. Nothing was imported.`);
  let records: Records;
  try {
    records = readArchive(unzipped.files);
  } catch (err) {
    if (err instanceof ArchiveRefused) throw new AppError('invalid_input', `The archive is damaged or incomplete: ${err.message}. Nothing was imported.`);
    throw err;
  }
  const d = await decide(deps, records);
  const report: CasebookImportReport = {
    dryRun: Boolean(options.dryRun),
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
  if (options.dryRun || d.cases.length === 0) return report;

  const storage = storagePaths(deps.config);
  const written: string[] = [];
  const stored = new Map<number, { file: string; thumbnail: string | null; sizeBytes: number; width: number | null; height: number | null; contentType: string }>();
  const now = new Date().toISOString();
  try {
    for (const a of d.attachments) {
      if (a.kind === 'screenshot') {
        // decoded and re-encoded exactly like an upload: header check, worker, no metadata kept
        const format = sniffImage(Buffer.from(a.bytes.subarray(0, 64)));
        const img = format ? await reencodeImage(Buffer.from(a.bytes), format) : null;
        if (img === null) throw new AppError('unsupported_type', `Attachment ${a.id} (“${a.originalName}”) does not decode as an image; nothing was imported`);
        if (img === 'too_many_pixels') throw new AppError('too_large', `Attachment ${a.id} (“${a.originalName}”) has over ${MAX_IMAGE_PIXELS / 1e6} megapixels; nothing was imported`);
        const file = storage.newName(img.extension);
        const thumbnail = storage.newName(img.extension).replace(/(\.\w+)$/, '.thumb$1');
        await writeFile(storage.fileFor(file), img.image);
        written.push(file);
        await writeFile(storage.fileFor(thumbnail), img.thumbnail);
        written.push(thumbnail);
        stored.set(a.id, { file, thumbnail, sizeBytes: img.image.length, width: img.width, height: img.height, contentType: img.contentType });
        continue;
      }
      const file = storage.newName('csv');
      await writeFile(storage.fileFor(file), a.bytes);
      written.push(file);
      stored.set(a.id, { file, thumbnail: null, sizeBytes: a.sizeBytes, width: a.width, height: a.height, contentType: a.contentType });
    }
    await deps.db.transaction().execute(async (trx) => {
      const localId = new Map<number, number>();
      for (const u of d.knownUsers.values()) {
        const here = d.localByEmail.get(u.email);
        if (here) localId.set(u.id, here);
      }
      for (const u of d.newUsers) {
        localId.set(u.id, await insertImportedUser(trx, { email: u.email, name: u.name, role: 'engineer', password_hash: null, active: 0, created_at: now, updated_at: now }));
      }
      const user = (id: number | null) => (id === null ? null : (localId.get(id) ?? null));
      for (const { record: c, raw } of d.cases) {
        const diagnosis = recomputeDiagnosis(c.setup, c.statedCause);
        await insertImportedCase(trx, {
          id: c.id,
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
          status: c.status,
          diagnosis: diagnosis.diagnosis ? JSON.stringify(diagnosis.diagnosis) : null,
          engine_cause: diagnosis.engineCause,
          cause: diagnosis.cause,
          disagrees: diagnosis.disagrees ? 1 : 0,
          review_note: c.reviewNote,
          duplicate_of: null,
          retired_reason: c.retiredReason,
          created_at: c.createdAt,
          updated_at: c.updatedAt,
          submitted_at: c.submittedAt,
          verified_at: c.verifiedAt,
        });
        await insertImportedTags(trx, c.id, c.tags, 'author');
        await insertImportedTags(trx, c.id, diagnosis.engineTags.filter((t) => !c.tags.includes(t)), 'engine');
      }
      // links between imported cases are set once every case exists
      for (const { record: c } of d.cases) if (c.duplicateOf) await linkImportedDuplicate(trx, c.id, c.duplicateOf);
      for (const { record: v, raw } of d.revisions) {
        await insertImportedRevision(trx, { id: v.id, case_id: v.caseId, number: v.number, author_id: user(v.authorId), snapshot: storedJson(raw.snapshot, v.snapshot), created_at: v.createdAt });
      }
      for (const m of d.comments) {
        await insertImportedComment(trx, { id: m.id, case_id: m.caseId, author_id: user(m.authorId)!, body: m.body, hidden: m.hidden ? 1 : 0, hidden_by: user(m.hiddenBy), created_at: m.createdAt, updated_at: m.updatedAt });
      }
      for (const a of d.attachments) {
        const s = stored.get(a.id)!;
        await insertImportedAttachment(trx, {
          id: a.id,
          case_id: a.caseId,
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
      for (const h of d.history) {
        const text = (v: unknown) => (v === null || v === undefined ? null : JSON.stringify(v));
        await insertImportedHistory(trx, { case_id: h.caseId, actor_id: user(h.actorId), action: h.action, before: text(h.before), after: text(h.after), note: h.note, created_at: h.createdAt });
      }
      for (const { record: c } of d.cases) {
        await insertImportedHistory(trx, { case_id: c.id, actor_id: actor.id, action: 'import', before: null, after: null, note: `Imported from a casebook archive exported ${records.manifest.exportedAt}`, created_at: now });
      }
      for (const p of [...d.pins].sort((a, b) => a.position - b.position)) await appendPinnedLesson(trx, p.caseId, actor.id, now);
    });
  } catch (err) {
    await Promise.all(written.map((n) => storage.remove(n)));
    // a refused file keeps its own status (413, 415); anything else is a failed write
    if (err instanceof AppError) throw err;
    throw new AppError('conflict', `The import failed and nothing was imported: ${(err as Error).message}`);
  }
  // rows went in beside the services, so the search index reads them afresh
  await deps.search?.rebuild();
  return report;
}
