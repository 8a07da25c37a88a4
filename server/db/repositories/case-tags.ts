import type { Db } from '../database';

export async function tagsOfCases(db: Db, caseIds: number[]): Promise<Map<number, string[]>> {
  const map = new Map<number, string[]>();
  if (caseIds.length === 0) return map;
  const rows = await db.selectFrom('case_tags').select(['case_id', 'tag']).where('case_id', 'in', caseIds).orderBy('tag').execute();
  for (const r of rows) map.set(r.case_id, [...(map.get(r.case_id) ?? []), r.tag]);
  return map;
}

/** Replaces a case's tags from one source (author or engine), leaving the other source's alone. */
export async function replaceCaseTags(db: Db, caseId: number, source: 'author' | 'engine', tags: string[]) {
  await db.deleteFrom('case_tags').where('case_id', '=', caseId).where('source', '=', source).execute();
  const existing = new Set((await db.selectFrom('case_tags').select('tag').where('case_id', '=', caseId).execute()).map((r) => r.tag));
  const fresh = [...new Set(tags)].filter((t) => !existing.has(t));
  if (fresh.length) await db.insertInto('case_tags').values(fresh.map((tag) => ({ case_id: caseId, tag, source }))).execute();
}
