import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Actor } from '../../shared/auth/roles';
import { openCaseSearch, type CaseSearch } from '../../server/search/case-search';
import { createTestContext, signedIn, type TestContext } from './helpers/test-context';

const query = (q: string) => ({ q, page: 1, pageSize: 20 });

async function until(what: string, test: () => boolean | Promise<boolean>, ms = 60_000) {
  const end = Date.now() + ms;
  while (!(await test())) {
    if (Date.now() > end) throw new Error(`gave up waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

describe('a search worker that dies', () => {
  let ctx: TestContext;
  let search: CaseSearch;
  let moderator: Actor;
  let dir: string;

  beforeAll(async () => {
    ctx = await createTestContext();
    const m = await ctx.db.selectFrom('users').select('id').where('role', '=', 'moderator').executeTakeFirstOrThrow();
    moderator = { id: m.id, role: 'moderator' };
    dir = mkdtempSync(path.join(tmpdir(), 'falsetrace-restart-'));
    search = await openCaseSearch(ctx.db, { worker: true, dataDir: dir, followMs: 200, snapshotDelayMs: 0 });
  });
  afterAll(async () => {
    await search?.close();
    await ctx?.close();
    rmSync(dir, { recursive: true, force: true });
  });

  it('should be started again, answer 503 meanwhile, and pick up what was written while it was down', async () => {
    const eng = await signedIn(ctx, 'engineer');
    const before = (await eng.post('/api/cases', { title: 'Numbatron relay chatter', summary: 'written before the crash' }).expect(201)).body.case.id;
    await search.followNow();
    expect((await search.search(moderator, query('numbatron'))).results.map((r) => r.id)).toEqual([before]);

    await search.killWorker();
    await until('the worker to be seen dead', () => !search.isReady());
    await expect(search.search(moderator, query('numbatron'))).rejects.toThrow(/loading/i);
    // written while no worker runs: the new one must learn of it from the change log
    const during = (await eng.post('/api/cases', { title: 'Numbatron gate ringing', summary: 'written while the worker was down' }).expect(201)).body.case.id;

    await until('a new worker to be ready', () => search.isReady());
    await until('the write made meanwhile to be indexed', async () => (await search.search(moderator, query('numbatron'))).total === 2);
    expect((await search.search(moderator, query('numbatron'))).results.map((r) => r.id).sort((a, b) => a - b)).toEqual([before, during]);
  });
});
