import type { Insertable, Selectable, Updateable } from 'kysely';
import type { Actor } from '../../../shared/auth/roles';
import { canModerate } from '../../../shared/auth/roles';
import type { CaseListQuery } from '../../../shared/schemas/case';
import type { CasesTable, Db } from '../database';
import { containsText } from './text-match';

export type CaseRow = Selectable<CasesTable>;
export type CaseRowWithAuthor = CaseRow & { author_name: string };

const withAuthor = (db: Db) =>
  db.selectFrom('cases').innerJoin('users', 'users.id', 'cases.author_id').selectAll('cases').select('users.name as author_name');

export const findCaseById = (db: Db, id: number): Promise<CaseRowWithAuthor | undefined> =>
  withAuthor(db).where('cases.id', '=', id).executeTakeFirst();

export const insertCase = (db: Db, row: Insertable<CasesTable>) =>
  db.insertInto('cases').values(row).returning('id').executeTakeFirstOrThrow();

export const updateCaseRow = (db: Db, id: number, patch: Updateable<CasesTable>) =>
  db.updateTable('cases').set(patch).where('id', '=', id).execute();

export const deleteCaseRow = (db: Db, id: number) => db.deleteFrom('cases').where('id', '=', id).execute();

const SORT_COLUMNS = {
  updatedAt: 'cases.updated_at',
  createdAt: 'cases.created_at',
  title: 'cases.title',
  status: 'cases.status',
  cause: 'cases.cause',
  author: 'users.name',
} as const;

/** One page of the cases the actor may see, filtered and sorted as asked, with the total. */
export async function listCases(db: Db, actor: Actor, q: CaseListQuery): Promise<{ rows: CaseRowWithAuthor[]; total: number }> {
  let base = db.selectFrom('cases').innerJoin('users', 'users.id', 'cases.author_id');
  if (!canModerate(actor)) base = base.where((eb) => eb.or([eb('cases.status', '=', 'verified'), eb('cases.author_id', '=', actor.id)]));
  if (q.status) base = base.where('cases.status', '=', q.status);
  if (q.cause) base = base.where('cases.cause', '=', q.cause);
  if (q.author) base = base.where('cases.author_id', '=', q.author);
  if (q.from) base = base.where('cases.updated_at', '>=', q.from);
  if (q.to) base = base.where('cases.updated_at', '<', `${q.to}T99`);
  if (q.tag) {
    const tag = q.tag.toLowerCase();
    base = base.where((eb) => eb.exists(eb.selectFrom('case_tags').select('case_tags.tag').whereRef('case_tags.case_id', '=', 'cases.id').where('case_tags.tag', '=', tag)));
  }
  if (q.q) {
    const text = q.q;
    base = base.where((eb) => eb.or([containsText('cases.title', text), containsText('cases.summary', text)]));
  }
  const { n } = await base.select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow();
  const desc = q.sort.startsWith('-');
  const column = SORT_COLUMNS[q.sort.replace(/^-/, '') as keyof typeof SORT_COLUMNS];
  // a deferred join: sort and cut the page on ids alone, then read the wide rows of that page only
  // (narratives and diagnosis JSON of every visible case would otherwise be sorted to return 20)
  const page = await base
    .select('cases.id')
    .orderBy(column, desc ? 'desc' : 'asc')
    .orderBy('cases.id', 'desc')
    .limit(q.pageSize)
    .offset((q.page - 1) * q.pageSize)
    .execute();
  if (page.length === 0) return { rows: [], total: Number(n) };
  const wide = await withAuthor(db).where('cases.id', 'in', page.map((p) => p.id)).execute();
  const byId = new Map(wide.map((r) => [r.id, r]));
  const rows = page.map((p) => byId.get(p.id)).filter((r): r is CaseRowWithAuthor => r !== undefined);
  return { rows, total: Number(n) };
}

/** Distinct authors of the cases the actor may see, for the author filter. */
export async function listCaseAuthors(db: Db, actor: Actor) {
  let q = db.selectFrom('cases').innerJoin('users', 'users.id', 'cases.author_id').select(['users.id', 'users.name']).distinct();
  if (!canModerate(actor)) q = q.where((eb) => eb.or([eb('cases.status', '=', 'verified'), eb('cases.author_id', '=', actor.id)]));
  return q.orderBy('users.name').execute();
}
