import { sql, type Insertable, type Selectable, type Updateable } from 'kysely';
import type { Actor } from '../../../shared/auth/roles';
import { canModerate } from '../../../shared/auth/roles';
import { CASE_STATUSES, type CaseListQuery } from '../../../shared/schemas/case';
import type { CasesTable, Db } from '../database';
import { isPostgres } from '../dialect';
import { containsText } from './text-match';

export type CaseRow = Selectable<CasesTable>;
export type CaseRowWithAuthor = CaseRow & { author_name: string };
/** The columns a row of the case list needs. */
export type CaseListRow = Pick<CaseRow, 'id' | 'author_id' | 'title' | 'summary' | 'status' | 'cause' | 'created_at' | 'updated_at'> & { author_name: string };
/** A row of the case list with its tags in order. */
export type ListedCase = CaseListRow & { tags: string[] };

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

/** Past this many matches (beyond the page asked for) the list says "at least" instead of counting every case. */
export const COUNT_CAP = 10_000;

type Branch = 'all' | 'verified' | 'own';
const NOT_VERIFIED = CASE_STATUSES.filter((s) => s !== 'verified');

/**
 * The visibility rule (shared/auth/case-policy: moderators see every case; others the verified
 * ones and their own) as one or two disjoint branches, each of which an index reads in order:
 * `status = 'verified' OR author_id = ?` would make SQLite read every case to sort them.
 */
function branchesFor(actor: Actor, q: CaseListQuery): Branch[] {
  if (canModerate(actor)) return ['all'];
  const out: Branch[] = [];
  if (!q.status || q.status === 'verified') out.push('verified');
  if ((!q.status || q.status !== 'verified') && (!q.author || q.author === actor.id)) out.push('own');
  return out;
}

/**
 * The cases the search index says may match the text filter (see server/search/list-filter.ts):
 * the substring test then reads only these rows. Past this many the id list costs more than the scan.
 */
export const TEXT_CANDIDATE_LIMIT = 5000;

function filtered(db: Db, actor: Actor, branch: Branch, q: CaseListQuery, sortsByAuthor: boolean, candidates?: number[]) {
  let base = sortsByAuthor ? db.selectFrom('cases').innerJoin('users', 'users.id', 'cases.author_id') : db.selectFrom('cases');
  if (branch === 'verified') base = base.where('cases.status', '=', 'verified');
  // listed, not `!= 'verified'`, so the (author_id, status, …) index can seek each one
  if (branch === 'own') base = base.where('cases.author_id', '=', actor.id).where('cases.status', 'in', NOT_VERIFIED);
  if (q.status && branch !== 'verified') base = base.where('cases.status', '=', q.status);
  if (q.cause) base = base.where('cases.cause', '=', q.cause);
  if (q.author && branch !== 'own') base = base.where('cases.author_id', '=', q.author);
  if (q.from) base = base.where('cases.updated_at', '>=', q.from);
  if (q.to) base = base.where('cases.updated_at', '<', `${q.to}T99`);
  if (q.tag) {
    const tag = q.tag.toLowerCase();
    base = base.where((eb) => eb.exists(eb.selectFrom('case_tags').select('case_tags.tag').whereRef('case_tags.case_id', '=', 'cases.id').where('case_tags.tag', '=', tag)));
  }
  if (q.q) {
    const text = q.q;
    if (candidates) base = base.where('cases.id', 'in', candidates.length ? candidates : [-1]);
    base = base.where((eb) => eb.or([containsText('cases.title', text), containsText('cases.summary', text)]));
  }
  return base;
}

/**
 * What changes whenever a count could: every write that changes a case's status, tags, text or
 * existence adds a row to the case change log (search follows it, see search/change-log.ts), and
 * every save sets updated_at; the highest case id covers an insert made without the log. Each
 * part is read from an index end: no count of every case (on PostgreSQL that is a full scan).
 * As three scalar subqueries, so that the page's own statement can carry them.
 */
const stampColumns = (db: Db) => [
  db.selectFrom('case_changes').select((e) => e.fn.max('id').as('c')).as('stamp_change'),
  db.selectFrom('cases').select((e) => e.fn.max('id').as('i')).as('stamp_id'),
  db.selectFrom('cases').select((e) => e.fn.max('updated_at').as('u')).as('stamp_at'),
];

type StampRow = { stamp_change: unknown; stamp_id: unknown; stamp_at: unknown };
const stampOf = (row: StampRow) => `${row.stamp_change ?? 0}|${row.stamp_id}|${row.stamp_at}`;

async function casebookStamp(db: Db): Promise<string> {
  return stampOf(await db.selectNoFrom(stampColumns(db)).executeTakeFirstOrThrow());
}

/** Counts by query, kept while the casebook stamp holds and at most COUNT_TTL_MS (tag renames do not touch cases). */
const COUNT_TTL_MS = 10_000;
const countCaches = new WeakMap<Db, Map<string, { stamp: string; at: number; n: number }>>();
async function cachedCount(db: Db, stamp: string, key: string, count: () => Promise<number>): Promise<number> {
  let cache = countCaches.get(db);
  if (!cache) countCaches.set(db, (cache = new Map()));
  const hit = cache.get(key);
  if (hit && hit.stamp === stamp && Date.now() - hit.at < COUNT_TTL_MS) return hit.n;
  const n = await count();
  if (cache.size >= 500) cache.delete(cache.keys().next().value!);
  cache.set(key, { stamp, at: Date.now(), n });
  return n;
}

/**
 * A case's tags as one JSON array column, in the order `tagsOfCases` gives (the column's own
 * collation): PostgreSQL's driver parses the json, SQLite hands back its text.
 */
const tagsColumn = (db: Db) =>
  sql<string[] | string>`(select ${sql.raw(isPostgres(db) ? "coalesce(json_agg(case_tags.tag order by case_tags.tag), '[]'::json)" : 'json_group_array(case_tags.tag order by case_tags.tag)')} from case_tags where case_tags.case_id = cases.id)`;

type Key = string | null;

/**
 * One page of the cases the actor may see, filtered and sorted as asked, with the total (exact up
 * to COUNT_CAP matches past the page, else that many and `totalCapped`). Each visibility branch
 * sorts and cuts ids on its indexes alone (a deferred join); the wide rows of the page are read last.
 * `candidates`, when given, narrows the text filter to those ids (the substring test still decides).
 */
export async function listCases(db: Db, actor: Actor, q: CaseListQuery, candidates?: number[]): Promise<{ rows: ListedCase[]; total: number; totalCapped: boolean }> {
  const sortName = q.sort.replace(/^-/, '') as keyof typeof SORT_COLUMNS;
  const column = SORT_COLUMNS[sortName];
  const dir = q.sort.startsWith('-') ? 'desc' : 'asc';
  const offset = (q.page - 1) * q.pageSize;
  const cap = offset + q.pageSize + COUNT_CAP;
  const branches = branchesFor(actor, q);
  if (branches.length === 0) return { rows: [], total: 0, totalCapped: false };
  // ties broken by id in the same direction, so one index gives each branch's whole order
  const idsOf = (branch: Branch, limit: number, skip: number) =>
    filtered(db, actor, branch, q, sortName === 'author', candidates)
      .select(['cases.id', sql<Key>`${sql.ref(column)}`.as('key')])
      .orderBy(sql.ref(column), dir)
      .orderBy('cases.id', dir)
      .limit(limit)
      .offset(skip);
  // Two branches each bring everything up to the page's end and are merged in SQL (one statement,
  // each branch still read in order from its index); one branch cuts its page itself.
  const pageIds =
    branches.length === 1
      ? idsOf(branches[0], q.pageSize, offset)
      : db
          .selectFrom(idsOf(branches[0], offset + q.pageSize, 0).as('first_branch'))
          .selectAll()
          .unionAll(db.selectFrom(idsOf(branches[1], offset + q.pageSize, 0).as('second_branch')).selectAll())
          .orderBy('key', dir)
          .orderBy('id', dir)
          .limit(q.pageSize)
          .offset(offset);
  // the deferred join: only the page's rows are read wide, and only what a list row shows
  // (narratives, setups and diagnosis JSON stay on disk); the tags, and the casebook's stamp that
  // says whether the counts kept still hold, come in the same statement (one round trip, not two)
  const narrow = await db
    .selectFrom(pageIds.as('page'))
    .innerJoin('cases', 'cases.id', 'page.id')
    .innerJoin('users', 'users.id', 'cases.author_id')
    .select(['cases.id', 'cases.author_id', 'cases.title', 'cases.summary', 'cases.status', 'cases.cause', 'cases.created_at', 'cases.updated_at', 'users.name as author_name'])
    .select(tagsColumn(db).as('tags'))
    .select(stampColumns(db))
    .orderBy(sql.ref(column), dir)
    .orderBy('cases.id', dir)
    .execute();
  // an empty page (past the end, or nothing matches) carries no stamp: read it on its own
  const stamp = narrow.length > 0 ? stampOf(narrow[0]) : await casebookStamp(db);
  let total = 0;
  let totalCapped = false;
  for (const branch of branches) {
    const n = await cachedCount(db, stamp, JSON.stringify([branch, branch === 'own' ? actor.id : 0, q.status, q.cause, q.author, q.from, q.to, q.tag, q.q, cap, candidates ? 'index' : 'scan']), async () => {
      const counted = await db
        .selectFrom(filtered(db, actor, branch, q, false, candidates).select(sql<number>`1`.as('one')).limit(cap).as('m'))
        .select((eb) => eb.fn.countAll<number>().as('n'))
        .executeTakeFirstOrThrow();
      return Number(counted.n);
    });
    total += n;
    if (n >= cap) totalCapped = true;
  }
  const rows: ListedCase[] = narrow.map(({ stamp_change: _c, stamp_id: _i, stamp_at: _a, ...r }) => ({ ...r, tags: typeof r.tags === 'string' ? (JSON.parse(r.tags) as string[]) : r.tags }));
  return { rows, total, totalCapped };
}

/**
 * Distinct authors of the cases the actor may see, for the author filter: one index seek per
 * person (there are far fewer people than cases) instead of reading every case.
 */
export async function listCaseAuthors(db: Db, actor: Actor) {
  const moderates = canModerate(actor);
  return db
    .selectFrom('users')
    .select(['users.id', 'users.name'])
    .where((eb) => {
      const wrote = eb.selectFrom('cases').select('cases.id').whereRef('cases.author_id', '=', 'users.id');
      if (moderates) return eb.exists(wrote);
      return eb.or([eb.exists(wrote.where('cases.status', '=', 'verified')), eb.and([eb('users.id', '=', actor.id), eb.exists(wrote)])]);
    })
    .orderBy('users.name')
    .execute();
}
