import type { Db } from '../database';

export async function watchCase(db: Db, userId: number, caseId: number) {
  await db.insertInto('watches').values({ user_id: userId, case_id: caseId, created_at: new Date().toISOString() }).onConflict((oc) => oc.doNothing()).execute();
}

export const unwatchCase = (db: Db, userId: number, caseId: number) =>
  db.deleteFrom('watches').where('user_id', '=', userId).where('case_id', '=', caseId).execute();

export async function watchTag(db: Db, userId: number, tag: string) {
  await db.insertInto('watches').values({ user_id: userId, tag, created_at: new Date().toISOString() }).onConflict((oc) => oc.doNothing()).execute();
}

export const unwatchTag = (db: Db, userId: number, tag: string) => db.deleteFrom('watches').where('user_id', '=', userId).where('tag', '=', tag).execute();

/** Users watching the case itself or any of its tags. */
export async function watchersOf(db: Db, caseId: number): Promise<number[]> {
  const rows = await db
    .selectFrom('watches')
    .select('user_id')
    .where((eb) =>
      eb.or([eb('case_id', '=', caseId), eb('tag', 'in', eb.selectFrom('case_tags').select('tag').where('case_tags.case_id', '=', caseId))]),
    )
    .distinct()
    .execute();
  return rows.map((r) => r.user_id);
}

export const watchesOfUser = (db: Db, userId: number) => db.selectFrom('watches').selectAll().where('user_id', '=', userId).execute();
