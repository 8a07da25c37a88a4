import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Actor } from '../../shared/auth/roles';
import { caseListQuerySchema } from '../../shared/schemas/case';
import { listCases } from '../../server/db/repositories/cases';
import { seedDemoCasebook } from '../../server/seed/demo/seed-casebook';
import { listCasesFor } from '../../server/services/cases';
import { listLessons } from '../../server/services/lessons';
import { createTestContext, type TestContext } from './helpers/test-context';

// The case list's text filter `q` reads the ids the search index names instead of scanning
// every case; for whole-word queries it must list exactly what the substring scan lists.
describe('case list text filter through the search index', () => {
  let ctx: TestContext;
  let words: string[];
  let actors: Actor[];
  beforeAll(async () => {
    ctx = await createTestContext();
    await seedDemoCasebook(ctx, ctx.config.demoPassword);
    const cases = await ctx.db.selectFrom('cases').select(['title', 'summary']).execute();
    const texts = cases.map((c) => [c.title.toLowerCase(), c.summary.toLowerCase()]).flat();
    // "whole-word" queries: wherever the scan finds them, they start a word of the text
    const startsWordsOnly = (q: string) =>
      texts.every((t) => {
        for (let at = t.indexOf(q); at >= 0; at = t.indexOf(q, at + 1)) if (at > 0 && /[\p{L}\p{N}]/u.test(t[at - 1])) return false;
        return true;
      });
    const distinct = [...new Set(texts.flatMap((t) => t.match(/\p{L}+/gu) ?? []))].sort();
    const pairs = cases.map((c) => c.title.toLowerCase().split(' ').slice(0, 2).join(' ')).filter((p) => /^\p{L}+ \p{L}+$/u.test(p));
    const candidates = [...distinct.filter((_, i) => i % 5 === 0), ...pairs, 'ringing', 'probe', 'the scope', 'ring', 'grou'];
    words = candidates.filter(startsWordsOnly);
    const engineer = await ctx.db.selectFrom('users').select('id').where('role', '=', 'engineer').orderBy('id').executeTakeFirstOrThrow();
    const moderator = await ctx.db.selectFrom('users').select('id').where('role', '=', 'moderator').orderBy('id').executeTakeFirstOrThrow();
    actors = [
      { id: engineer.id, role: 'engineer' },
      { id: moderator.id, role: 'moderator' },
    ];
  }, 180_000);
  afterAll(() => ctx?.close());

  it('should list the same cases, totals and pages as the substring scan for whole-word queries', async () => {
    expect(words.length).toBeGreaterThan(30);
    let served = 0;
    for (const q of words) {
      if ((await ctx.search.listCandidates(q, 5000)) !== undefined) served++;
      for (const actor of actors) {
        for (const params of [{ q }, { q, sort: 'title', pageSize: 3, page: 2 }, { q, status: 'verified' }]) {
          const query = caseListQuerySchema.parse(params);
          const scanned = await listCases(ctx.db, actor, query);
          const listed = await listCasesFor(ctx, actor, query);
          expect(listed.total, `${q} ${JSON.stringify(params)}`).toBe(scanned.total);
          expect(listed.cases.map((c) => c.id), `${q} ${JSON.stringify(params)}`).toEqual(scanned.rows.map((r) => r.id));
        }
      }
    }
    // most of these words are answered by the index, not by the fallback scan
    expect(served).toBeGreaterThan(words.length / 2);
  });

  it('should fall back to the scan for numbers, unit words and function words, which the index folds or drops', async () => {
    for (const q of ['50', 'ohm', 'MHz', 'mh', 'the', 'ab']) expect(await ctx.search.listCandidates(q, 5000), q).toBeUndefined();
  });

  it('should give the Lessons page the same lessons and counts through the index as by the substring scan', async () => {
    const lessons = await ctx.db.selectFrom('cases').select(['title', 'lesson_summary', 'lesson_detail']).where('status', '=', 'verified').execute();
    const texts = lessons.flatMap((l) => [l.title, l.lesson_summary ?? '', l.lesson_detail ?? ''].map((t) => t.toLowerCase()));
    const startsWordsOnly = (q: string) =>
      texts.every((t) => {
        for (let at = t.indexOf(q); at >= 0; at = t.indexOf(q, at + 1)) if (at > 0 && /[\p{L}\p{N}]/u.test(t[at - 1])) return false;
        return true;
      });
    const distinct = [...new Set(texts.flatMap((t) => t.match(/\p{L}+/gu) ?? []))].sort();
    const queries = [...distinct.filter((_, i) => i % 4 === 0), 'probe', 'ground', 'spring tip'].filter(startsWordsOnly);
    expect(queries.length).toBeGreaterThan(20);
    let served = 0;
    const summary = (book: Awaited<ReturnType<typeof listLessons>>) => book.groups.map((g) => [g.cause, g.total, g.lessons.map((l) => l.caseId)]);
    for (const q of queries) {
      if ((await ctx.search.listCandidates(q, 5000, 'lessons')) !== undefined) served++;
      const scanned = await listLessons({ ...ctx, search: undefined }, q);
      const indexed = await listLessons(ctx, q);
      expect(summary(indexed), q).toEqual(summary(scanned));
    }
    expect(served).toBeGreaterThan(queries.length / 2);
  });
});
