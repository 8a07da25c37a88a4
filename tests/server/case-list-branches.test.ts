import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { canSeeCase } from '../../shared/auth/case-policy';
import { caseListQuerySchema, type CaseStatus } from '../../shared/schemas/case';
import { openDatabase, type Db } from '../../server/db/database';
import { migrateToLatest } from '../../server/db/migrate';
import { insertCase, listCases } from '../../server/db/repositories/cases';
import { seedBenchCasebook } from '../../server/seed/bench/generate-cases';
import { StatementCounter } from './helpers/statement-counter';

// The list reads an engineer's cases as two branches merged in one statement; it must give exactly the
// page a plain filter-and-sort over every visible case gives, for every sort and across pages.
describe('case list visibility branches', () => {
  let db: Db;
  let all: { id: number; author_id: number; status: CaseStatus; title: string; cause: string | null; updated_at: string; created_at: string; name: string }[];
  beforeAll(async () => {
    db = openDatabase(':memory:');
    await migrateToLatest(db);
    await seedBenchCasebook(db, { count: 400, password: 'pw-for-the-bench', extraPeople: 6 });
    all = await db.selectFrom('cases').innerJoin('users', 'users.id', 'cases.author_id').select(['cases.id', 'author_id', 'status', 'title', 'cause', 'cases.updated_at', 'cases.created_at', 'users.name']).execute();
  });
  afterAll(() => db.destroy());

  const key = { updatedAt: 'updated_at', createdAt: 'created_at', title: 'title', status: 'status', cause: 'cause', author: 'name' } as const;
  const cmp = (a: string | null, b: string | null) => (a === b ? 0 : a === null ? -1 : b === null ? 1 : a < b ? -1 : 1);

  it.each(['-updatedAt', 'title', '-title', 'cause', '-cause', 'author', 'status', 'createdAt'] as const)('matches a plain sort for %s', async (sort) => {
    const authorOfMany = all.reduce((m, c) => m.set(c.author_id, (m.get(c.author_id) ?? 0) + 1), new Map<number, number>());
    const engineer = { id: [...authorOfMany.entries()].sort((a, b) => b[1] - a[1])[0][0], role: 'engineer' as const };
    const field = key[sort.replace('-', '') as keyof typeof key];
    const sign = sort.startsWith('-') ? -1 : 1;
    const expected = all
      .filter((c) => canSeeCase(engineer, { authorId: c.author_id, status: c.status }))
      .sort((a, b) => sign * (cmp(a[field], b[field]) || a.id - b.id))
      .map((c) => c.id);
    for (const page of [1, 3]) {
      const got = await listCases(db, engineer, caseListQuerySchema.parse({ sort, page, pageSize: 25 }));
      expect(got.total).toBe(expected.length);
      expect(got.totalCapped).toBe(false);
      expect(got.rows.map((r) => r.id)).toEqual(expected.slice((page - 1) * 25, page * 25));
    }
  });

  it('gives a moderator every case, and an engineer a status filter only where they may look', async () => {
    const mod = await listCases(db, { id: 2, role: 'moderator' }, caseListQuerySchema.parse({ status: 'draft' }));
    expect(mod.total).toBe(all.filter((c) => c.status === 'draft').length);
    const someone = all.find((c) => c.status === 'draft')!.author_id;
    const eng = await listCases(db, { id: someone, role: 'engineer' }, caseListQuerySchema.parse({ status: 'draft', pageSize: 100 }));
    expect(eng.rows.every((r) => r.author_id === someone)).toBe(true);
    expect(eng.total).toBe(all.filter((c) => c.status === 'draft' && c.author_id === someone).length);
  });

  it('reads a page again in one statement while the casebook is unchanged, and counts again after a change', async () => {
    const counter = new StatementCounter();
    const counted = db.withPlugin(counter);
    const engineer = { id: all[0].author_id, role: 'engineer' as const };
    const query = caseListQuerySchema.parse({});
    const first = await listCases(counted, engineer, query);
    counter.statements = 0;
    const again = await listCases(counted, engineer, query);
    // the page, its tags and the stamp that says the kept counts still hold: one round trip
    expect(counter.statements).toBe(1);
    expect(again).toEqual(first);

    const now = new Date().toISOString();
    const { id } = await insertCase(db, { author_id: engineer.id, status: 'verified', title: 'Added after the count', summary: 'A new verified case.', created_at: now, updated_at: now });
    counter.statements = 0;
    const after = await listCases(counted, engineer, query);
    expect(after.total).toBe(first.total + 1);
    expect(after.rows[0].id).toBe(id);
    expect(counter.statements).toBeGreaterThan(1);
  });
});
