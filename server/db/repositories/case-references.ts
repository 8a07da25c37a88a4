import type { Db } from '../database';

/** Replaces what one text (a case's write-up when commentId is null, else one comment) links to. */
export async function replaceReferences(db: Db, sourceCaseId: number, commentId: number | null, targetIds: number[]) {
  let del = db.deleteFrom('case_references').where('source_case_id', '=', sourceCaseId);
  del = commentId === null ? del.where('comment_id', 'is', null) : del.where('comment_id', '=', commentId);
  await del.execute();
  const targets = targetIds.filter((t) => t !== sourceCaseId);
  if (targets.length) {
    await db
      .insertInto('case_references')
      .values(targets.map((t) => ({ source_case_id: sourceCaseId, comment_id: commentId, target_case_id: t })))
      .execute();
  }
}

/** Cases by id with what the visibility policy needs. */
export const caseFactsByIds = (db: Db, ids: number[]) =>
  ids.length === 0
    ? Promise.resolve([])
    : db.selectFrom('cases').select(['id', 'title', 'author_id', 'status']).where('id', 'in', ids).execute();

/** The cases whose write-up or comments link to this one (each once), newest first. */
export const referrersOf = (db: Db, targetCaseId: number) =>
  db
    .selectFrom('case_references')
    .innerJoin('cases', 'cases.id', 'case_references.source_case_id')
    .select(['cases.id', 'cases.title', 'cases.author_id', 'cases.status'])
    .distinct()
    .where('case_references.target_case_id', '=', targetCaseId)
    .orderBy('cases.id', 'desc')
    .limit(200)
    .execute();
