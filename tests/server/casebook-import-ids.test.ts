import { readdirSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemoCasebook } from '../../server/seed/demo/seed-casebook';
import { storagePaths } from '../../server/storage';
import { downloadCasebook } from './helpers/casebook-download';
import { createTestContext, signedIn, type TestContext } from './helpers/test-context';

type Client = Awaited<ReturnType<typeof signedIn>>;


const upload = (c: Client, zip: Uint8Array, query = '') => c.upload(`/api/admin/casebook/import${query}`, Buffer.from(zip), 'casebook.zip', 'application/zip');

/** Each case by title and creation time (the same case in both casebooks), with what hangs on it. */
async function byCase(ctx: TestContext) {
  const { db } = ctx;
  const cases = await db.selectFrom('cases').select(['id', 'title', 'created_at', 'duplicate_of', 'retired_reason']).execute();
  const name = new Map(cases.map((c) => [c.id, `${c.title} @ ${c.created_at}`]));
  const out = new Map<string, unknown>();
  for (const c of cases) {
    const comments = await db.selectFrom('comments').select('body').where('case_id', '=', c.id).orderBy('id').execute();
    const revisions = await db.selectFrom('case_revisions').select(['number', 'snapshot']).where('case_id', '=', c.id).orderBy('id').execute();
    const attachments = await db.selectFrom('attachments').select(['original_name', 'kind']).where('case_id', '=', c.id).orderBy('id').execute();
    const tags = await db.selectFrom('case_tags').select(['tag', 'source']).where('case_id', '=', c.id).orderBy('tag').execute();
    const history = await db.selectFrom('audit_log').select(['action', 'after']).where('case_id', '=', c.id).where('action', '!=', 'import').orderBy('id').execute();
    out.set(name.get(c.id)!, {
      duplicateOf: c.duplicate_of === null ? null : name.get(c.duplicate_of),
      comments: comments.map((m) => m.body),
      revisions,
      attachments,
      tags,
      // a history entry naming the original does so by its id in this casebook
      history: history.map((h) => {
        const after = h.after === null ? null : JSON.parse(h.after);
        return { action: h.action, original: typeof after?.duplicateOf === 'number' ? name.get(after.duplicateOf) : undefined };
      }),
    });
  }
  return out;
}

const caseCount = async (ctx: TestContext) => (await ctx.db.selectFrom('cases').select('id').execute()).length;

describe('casebook import gives imported records their own ids', () => {
  let source: TestContext;
  let target: TestContext;
  let archive: Buffer;
  let archived: number;
  const ownTitles = ['Our own first case', 'Our own second case', 'Our own third case'];
  beforeAll(async () => {
    [source, target] = await Promise.all([createTestContext(), createTestContext()]);
    await seedDemoCasebook(source, source.config.demoPassword);
    archive = await downloadCasebook(await signedIn(source, 'admin'));
    archived = await caseCount(source);
    // the target already holds unrelated cases numbered 1, 2, 3 (the archive's numbers too)
    const eng = await signedIn(target, 'engineer');
    for (const title of ownTitles) {
      const id = (await eng.post('/api/cases', { title, summary: 'a case written in this casebook' }).expect(201)).body.case.id;
      await eng.post(`/api/cases/${id}/comments`, { body: `A comment on ${title}` }).expect(201);
    }
  }, 180_000);
  afterAll(async () => {
    await source?.close();
    await target?.close();
  });

  it('should import every case of the archive beside unrelated cases with the same numbers, references intact', async () => {
    const admin = await signedIn(target, 'admin');
    const own = await target.db.selectFrom('cases').select(['id', 'title']).orderBy('id').execute();
    expect(own.map((c) => c.id)).toEqual([1, 2, 3]);

    const dry = (await upload(admin, archive, '?dryRun=1').expect(200)).body.report;
    expect([dry.dryRun, dry.imported.cases, dry.skipped]).toEqual([true, archived, []]);
    expect(await caseCount(target)).toBe(3);

    const { report } = (await upload(admin, archive).expect(200)).body;
    expect(report.skipped).toEqual([]);
    expect(report.refused).toEqual([]);
    expect(report.imported.cases).toBe(archived);
    expect(await caseCount(target)).toBe(3 + archived);
    // our own cases and their comments are untouched
    expect(await target.db.selectFrom('cases').select(['id', 'title']).where('id', '<=', 3).orderBy('id').execute()).toEqual(own);
    const ownComments = await target.db.selectFrom('comments').select(['case_id', 'body']).where('case_id', '<=', 3).orderBy('case_id').execute();
    expect(ownComments).toEqual(ownTitles.map((t, i) => ({ case_id: i + 1, body: `A comment on ${t}` })));

    // every imported case carries the same comments, revisions, attachments, tags and links as in the source
    const there = await byCase(source);
    const here = await byCase(target);
    for (const [key, value] of there) expect(here.get(key), key).toEqual(value);
    const duplicates = [...there.values()].filter((v) => (v as { duplicateOf: unknown }).duplicateOf);
    expect(duplicates.length).toBeGreaterThan(0);
  });

  it('should recognise the same archive imported again and add nothing', async () => {
    const admin = await signedIn(target, 'admin');
    const before = await caseCount(target);
    const { report } = (await upload(admin, archive).expect(200)).body;
    expect(report.imported.cases).toBe(0);
    expect(report.skipped.filter((n: { kind: string }) => n.kind === 'case')).toHaveLength(archived);
    expect(report.skipped[0].reason).toMatch(/already in this casebook as #\d+/);
    expect(await caseCount(target)).toBe(before);
  });

  it('should import while other writes and a second import of the same archive race it, without a conflict or a duplicate', async () => {
    const fresh = await createTestContext();
    try {
      const admin = await signedIn(fresh, 'admin');
      const other = await signedIn(fresh, 'admin');
      const eng = await signedIn(fresh, 'engineer');
      const writes = Array.from({ length: 6 }, (_, i) => eng.post('/api/cases', { title: `Written during the import ${i + 1}`, summary: 'a case racing the import' }));
      const [first, second, ...created] = await Promise.all([upload(admin, archive), upload(other, archive), ...writes]);
      expect([first.status, second.status], JSON.stringify([first.body.error, second.body.error])).toEqual([200, 200]);
      for (const res of created) expect(res.status).toBe(201);
      // one import took every case, the other found them here already
      expect([first.body.report.imported.cases, second.body.report.imported.cases].sort((a, b) => a - b)).toEqual([0, archived]);
      expect(await caseCount(fresh)).toBe(archived + 6);
      const titles = (await fresh.db.selectFrom('cases').select('title').execute()).map((c) => c.title);
      for (let i = 1; i <= 6; i++) expect(titles).toContain(`Written during the import ${i}`);
      // no file is left behind by the import that found everything here
      const rows = await fresh.db.selectFrom('attachments').select(['storage_name', 'thumbnail_name']).execute();
      expect(rows.length).toBe((await source.db.selectFrom('attachments').select('id').execute()).length);
      const kept = rows.flatMap((r) => [r.storage_name, ...(r.thumbnail_name ? [r.thumbnail_name] : [])]).sort();
      const onDisk = readdirSync(storagePaths(fresh.config).uploadsDir, { withFileTypes: true }).filter((f) => f.isFile()).map((f) => f.name).sort();
      expect(onDisk).toEqual(kept);
    } finally {
      await fresh.close();
    }
  });
});
