/**
 * npm run bench:plans — on a seeded DATA_DIR (npm run seed:bench -- 100000), times every
 * list-like read the pages make (median of 5) and prints SQLite's EXPLAIN QUERY PLAN for each
 * statement it ran, flagging a SCAN of cases or case_tags (a read of every case).
 */
import path from 'node:path';
import { Kysely, SqliteDialect, type CompiledQuery } from 'kysely';
import type { Actor } from '../shared/auth/roles';
import { caseListQuerySchema } from '../shared/schemas/case';
import { openDatabase, sqliteOf, type Database } from '../server/db/database';
import type { AppDeps } from '../server/deps';
import { authorsFor, listCasesFor, loadCase } from '../server/services/cases';
import { commentsOf } from '../server/services/comments';
import { historyOf } from '../server/services/history';
import { listLessons } from '../server/services/lessons';
import { listPeople } from '../server/services/people';
import { reviewQueue, waitingCount } from '../server/services/review-queue';
import { listTags } from '../server/services/tags';

const dataDir = path.resolve(process.env.DATA_DIR ?? './data');
const base = openDatabase(path.join(dataDir, 'falsetrace.sqlite'));
const sqlite = sqliteOf(base);
let seen: CompiledQuery[] = [];
const db = new Kysely<Database>({ dialect: new SqliteDialect({ database: sqlite }), log: (e) => {
  if (e.level === 'query') seen.push(e.query);
} });
const deps = { db } as unknown as AppDeps;
const verbose = process.argv.includes('--plans');

const people = await db.selectFrom('users').select(['id', 'role', 'name', 'email']).orderBy('id').execute();
const moderator = people.find((p) => p.role === 'moderator')!;
const engineer = people.find((p) => p.role === 'engineer')!;
const cases = await db.selectFrom('cases').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow();
const someTag = (await db.selectFrom('case_tags').select('tag').where('case_id', '=', 1).executeTakeFirst())?.tag ?? 'ringing';
const someCase = (await db.selectFrom('cases').select('id').where('status', '=', 'verified').orderBy('id', 'desc').executeTakeFirstOrThrow()).id;
console.log(`${dataDir}: ${cases.n} cases; as engineer #${engineer.id} and moderator #${moderator.id}`);

const list = (q: Record<string, unknown>) => caseListQuerySchema.parse(q);
const asActor = (p: typeof engineer): Actor => ({ id: p.id, role: p.role });
const reads: [string, () => Promise<unknown>][] = [];
for (const who of [engineer, moderator]) {
  const a = asActor(who);
  const as = who.role;
  reads.push(
    [`${as}: cases page 1`, () => listCasesFor(deps, a, list({}))],
    [`${as}: cases page 200`, () => listCasesFor(deps, a, list({ page: 200 }))],
    [`${as}: cases by title`, () => listCasesFor(deps, a, list({ sort: 'title' }))],
    [`${as}: cases by author`, () => listCasesFor(deps, a, list({ sort: 'author' }))],
    [`${as}: cases by cause`, () => listCasesFor(deps, a, list({ sort: '-cause' }))],
    [`${as}: cause=loading`, () => listCasesFor(deps, a, list({ cause: 'loading' }))],
    [`${as}: status=draft`, () => listCasesFor(deps, a, list({ status: 'draft' }))],
    [`${as}: status=verified`, () => listCasesFor(deps, a, list({ status: 'verified' }))],
    [`${as}: tag=${someTag}`, () => listCasesFor(deps, a, list({ tag: someTag }))],
    [`${as}: author=${moderator.id}`, () => listCasesFor(deps, a, list({ author: moderator.id }))],
    [`${as}: q=ringing`, () => listCasesFor(deps, a, list({ q: 'ringing' }))],
    [`${as}: q=nothing-matches`, () => listCasesFor(deps, a, list({ q: 'zzqx' }))],
    [`${as}: cause+tag+q`, () => listCasesFor(deps, a, list({ cause: 'ground-lead', tag: 'ringing', q: 'edge' }))],
    [`${as}: authors`, () => authorsFor(deps, a)],
    [`${as}: tags`, () => listTags(deps, a)],
    [`${as}: case page`, async () => { await loadCase(db, a, someCase); await commentsOf(deps, a, someCase); await historyOf(deps, a, someCase); }],
  );
}
reads.push(
  ['lessons', () => listLessons(deps)],
  ['lessons q=probe', () => listLessons(deps, 'probe')],
  ['review queue', () => reviewQueue(deps, { ...moderator, active: true } as never, {})],
  ['review count', () => waitingCount(deps)],
  ['people', () => listPeople(deps)],
);

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
let scans = 0;
for (const [name, read] of reads) {
  seen = [];
  const t0 = performance.now();
  await read();
  const first = performance.now() - t0;
  const statements = seen;
  seen = [];
  const times = [first];
  for (let i = 0; i < 4 && first < 2000; i++) {
    const t = performance.now();
    await read();
    times.push(performance.now() - t);
  }
  const plans = [...new Map(statements.map((q) => [q.sql, q])).values()].map((q) => {
    const rows = sqlite.prepare(`EXPLAIN QUERY PLAN ${q.sql}`).all(...(q.parameters as unknown[])) as { detail: string }[];
    return { sql: q.sql, detail: rows.map((r) => r.detail) };
  });
  const full = plans.flatMap((p) => p.detail).filter((d) => /^SCAN (cases|case_tags|c|ct)\b/.test(d) && !/USING (COVERING )?INDEX .*\(.*=/.test(d));
  if (full.length) scans++;
  console.log(`${name.padEnd(34)} ${median(times).toFixed(1).padStart(8)} ms  ${statements.length} statements${full.length ? `  FULL: ${full.join('; ')}` : ''}`);
  if (verbose) for (const p of plans) console.log(`    ${p.sql.slice(0, 160)}\n      ${p.detail.join('\n      ')}`);
}
console.log(`\n${scans} of ${reads.length} reads scan every case`);
await base.destroy();
