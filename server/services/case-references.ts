import { canSeeCase } from '../../shared/auth/case-policy';
import type { Actor } from '../../shared/auth/roles';
import { referencedCaseIds, type CaseReference } from '../../shared/cases/case-references';
import type { Db } from '../db/database';
import { caseFactsByIds, referrersOf, replaceReferences } from '../db/repositories/case-references';

type FactsRow = { id: number; title: string; author_id: number; status: Parameters<typeof canSeeCase>[1]['status'] };

// the policy GET /api/cases/:id asks; a case the reader may not open is left out, existing or not
const visibleTo = (actor: Actor, rows: FactsRow[]): CaseReference[] =>
  rows.filter((r) => canSeeCase(actor, { authorId: r.author_id, status: r.status })).map((r) => ({ id: r.id, title: r.title }));

/** The cases named as `#123` in these texts that the reader may open, in order of mention. */
export const visibleReferences = (db: Db, actor: Actor, ...texts: (string | null | undefined)[]): Promise<CaseReference[]> =>
  visibleCasesByIds(db, actor, referencedCaseIds(...texts));

/** Of these case ids, the cases the reader may open, with their titles, in the given order (a draft's preview). */
export async function visibleCasesByIds(db: Db, actor: Actor, ids: number[]): Promise<CaseReference[]> {
  const byId = new Map((await caseFactsByIds(db, ids)).map((r) => [r.id, r]));
  return visibleTo(actor, ids.flatMap((id) => byId.get(id) ?? []));
}

/** Like `visibleReferences` for many texts at once (a comment thread, a lesson list): one query. */
export async function visibleReferencesOfEach(db: Db, actor: Actor, texts: (string | null | undefined)[][]): Promise<CaseReference[][]> {
  const idsPer = texts.map((t) => referencedCaseIds(...t));
  const rows = await caseFactsByIds(db, [...new Set(idsPer.flat())]);
  const visible = new Map(visibleTo(actor, rows).map((r) => [r.id, r]));
  return idsPer.map((ids) => ids.flatMap((id) => visible.get(id) ?? []));
}

/** The cases linking to this one that the reader may open. */
export async function visibleReferrers(db: Db, actor: Actor, caseId: number): Promise<CaseReference[]> {
  return visibleTo(actor, await referrersOf(db, caseId));
}

/** Keeps the link table in step with a case's write-up (narrative and lesson). */
export const recordWriteUpReferences = (db: Db, caseId: number, narrative: string | null, lessonDetail: string | null) =>
  replaceReferences(db, caseId, null, referencedCaseIds(narrative, lessonDetail));

/** Keeps the link table in step with one comment; a hidden comment links nowhere. */
export const recordCommentReferences = (db: Db, caseId: number, commentId: number, body: string | null) =>
  replaceReferences(db, caseId, commentId, referencedCaseIds(body));
