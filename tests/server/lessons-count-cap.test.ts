import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { LESSON_COUNT_CAP, LESSONS_PER_GROUP } from '../../server/services/lessons';
import { createTestContext, signedIn, type TestContext } from './helpers/test-context';

describe('lesson counts in a large casebook', () => {
  let ctx: TestContext;

  beforeAll(async () => {
    ctx = await createTestContext();
    const author = (await ctx.db.selectFrom('users').select('id').orderBy('id').executeTakeFirstOrThrow()).id;
    const row = (k: number, cause: string) => {
      const at = new Date(Date.UTC(2026, 0, 1) + k * 60_000).toISOString();
      return { author_id: author, title: `Bench case ${k}`, summary: 'generated for the count cap', status: 'verified' as const, cause, lesson_summary: `Lesson ${k}`, created_at: at, updated_at: at, verified_at: at };
    };
    const rows = [...Array.from({ length: LESSON_COUNT_CAP + 3 }, (_, k) => row(k, 'bandwidth')), row(5000, 'loading'), row(5001, 'loading')];
    for (let i = 0; i < rows.length; i += 200) await ctx.db.insertInto('cases').values(rows.slice(i, i + 200)).execute();
  });
  afterAll(() => ctx.close());

  it('should stop a group count at the cap and say so, and count a small group exactly', async () => {
    const eng = await signedIn(ctx, 'engineer');
    const { groups } = (await eng.get('/api/lessons').expect(200)).body as { groups: { cause: string; total: number; totalCapped?: boolean; lessons: unknown[] }[] };
    const bandwidth = groups.find((g) => g.cause === 'bandwidth')!;
    expect(bandwidth).toMatchObject({ total: LESSON_COUNT_CAP, totalCapped: true });
    expect(bandwidth.lessons).toHaveLength(LESSONS_PER_GROUP);
    const loading = groups.find((g) => g.cause === 'loading')!;
    expect(loading.total).toBe(2);
    expect(loading.totalCapped).toBeUndefined();
  });
});
