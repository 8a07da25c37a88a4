import type { CaseStatus } from '../../../shared/schemas/case';
import type { Db } from '../database';

/** What the search index reads of a case. */
export interface SearchSourceRow {
  id: number;
  author_id: number;
  status: CaseStatus;
  title: string;
  summary: string;
  narrative: string;
  setup: string;
  stated_cause: string | null;
  stated_cause_other: string | null;
  cause: string | null;
  engine_cause: string | null;
  fix: string | null;
  lesson_summary: string | null;
  lesson_detail: string | null;
  updated_at: string;
}

const COLUMNS = [
  'id', 'author_id', 'status', 'title', 'summary', 'narrative', 'setup', 'stated_cause', 'stated_cause_other',
  'cause', 'engine_cause', 'fix', 'lesson_summary', 'lesson_detail', 'updated_at',
] as const;

export const searchSourceRows = (db: Db, ids?: number[]): Promise<SearchSourceRow[]> => {
  let q = db.selectFrom('cases').select(COLUMNS);
  if (ids) q = q.where('id', 'in', ids.length ? ids : [-1]);
  return q.orderBy('id').execute();
};

/** What a result card shows of a case and highlights in it. */
export type SearchPageRow = Pick<SearchSourceRow, 'id' | 'title' | 'summary' | 'cause' | 'narrative' | 'fix' | 'lesson_summary' | 'lesson_detail'>;

/** The shown page's cases: the card's text only (the setup JSON and the facts stay in the database; the index has them). */
export const searchPageRows = (db: Db, ids: number[]): Promise<SearchPageRow[]> =>
  db
    .selectFrom('cases')
    .select(['id', 'title', 'summary', 'cause', 'narrative', 'fix', 'lesson_summary', 'lesson_detail'])
    .where('id', 'in', ids.length ? ids : [-1])
    .execute();

/** Tags per case, for the cases asked for (all when `ids` is left out). */
export async function searchTags(db: Db, ids?: number[]): Promise<Map<number, string[]>> {
  let q = db.selectFrom('case_tags').select(['case_id', 'tag']);
  if (ids) q = q.where('case_id', 'in', ids.length ? ids : [-1]);
  const map = new Map<number, string[]>();
  for (const r of await q.orderBy('tag').execute()) map.set(r.case_id, [...(map.get(r.case_id) ?? []), r.tag]);
  return map;
}

/** Synonyms grouped by their tag. */
export async function synonymsByTag(db: Db): Promise<Map<string, string[]>> {
  const map = new Map<string, string[]>();
  for (const r of await db.selectFrom('tag_synonyms').select(['synonym', 'tag']).orderBy('synonym').execute()) map.set(r.tag, [...(map.get(r.tag) ?? []), r.synonym]);
  return map;
}

/**
 * A fingerprint of everything the index is built from: a snapshot whose stamp differs is stale.
 * Every case write sets updated_at and deletes change the count; tag renames and synonym
 * edits change the tag sums.
 */
export async function searchSourceStamp(db: Db): Promise<string> {
  const c = await db.selectFrom('cases').select((eb) => [eb.fn.countAll<number>().as('n'), eb.fn.max('updated_at').as('latest'), eb.fn.sum<number>('id').as('ids')]).executeTakeFirstOrThrow();
  const t = await db.selectFrom('case_tags').select((eb) => [eb.fn.countAll<number>().as('n'), eb.fn.sum<number>(eb.fn('length', ['tag'])).as('len')]).executeTakeFirstOrThrow();
  const s = await db.selectFrom('tag_synonyms').select((eb) => [eb.fn.countAll<number>().as('n'), eb.fn.sum<number>(eb.fn('length', ['synonym'])).as('len')]).executeTakeFirstOrThrow();
  return [c.n, c.latest ?? '', c.ids ?? 0, t.n, t.len ?? 0, s.n, s.len ?? 0].join('|');
}
