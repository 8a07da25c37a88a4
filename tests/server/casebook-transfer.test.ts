import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { unzipSync, zipSync } from 'fflate';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemoCasebook } from '../../server/seed/demo/seed-casebook';
import { storagePaths } from '../../server/storage';
import { downloadCasebook } from './helpers/casebook-download';
import { createTestContext, ON_POSTGRES, signedIn, type TestContext } from './helpers/test-context';

const sha = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex');

type Client = Awaited<ReturnType<typeof signedIn>>;


const upload = (c: Client, zip: Uint8Array, query = '') => c.upload(`/api/admin/casebook/import${query}`, Buffer.from(zip), 'casebook.zip', 'application/zip');

/**
 * What a casebook holds, with users by e-mail and records numbered by their order (an import gives
 * new ids, in the archive's order), files by content.
 */
async function contents(ctx: TestContext) {
  const { db } = ctx;
  const storage = storagePaths(ctx.config);
  const emails = new Map((await db.selectFrom('users').select(['id', 'email']).execute()).map((u) => [u.id, u.email]));
  const who = (id: number | null) => (id === null ? null : emails.get(id));
  const cases = await db.selectFrom('cases').selectAll().orderBy('id').execute();
  const revisions = await db.selectFrom('case_revisions').selectAll().orderBy('id').execute();
  const comments = await db.selectFrom('comments').selectAll().orderBy('id').execute();
  const attachments = await db.selectFrom('attachments').selectAll().orderBy('id').execute();
  const tags = await db.selectFrom('case_tags').selectAll().orderBy('case_id').orderBy('tag').execute();
  const nth = (rows: { id: number }[]) => {
    const order = new Map(rows.map((r, i) => [r.id, i + 1]));
    return (id: number | null) => (id === null ? null : order.get(id));
  };
  const [caseNo, revisionNo, commentNo, attachmentNo] = [nth(cases), nth(revisions), nth(comments), nth(attachments)];
  return {
    cases: cases.map(({ author_id, origin_key: _o, ...c }) => ({ ...c, id: caseNo(c.id), duplicate_of: caseNo(c.duplicate_of), author: who(author_id) })),
    tags: tags.map((t) => ({ ...t, case_id: caseNo(t.case_id) })),
    revisions: revisions.map(({ author_id, ...r }) => ({ ...r, id: revisionNo(r.id), case_id: caseNo(r.case_id), author: who(author_id) })),
    comments: comments.map(({ author_id, hidden_by, ...m }) => ({ ...m, id: commentNo(m.id), case_id: caseNo(m.case_id), author: who(author_id), hiddenBy: who(hidden_by) })),
    attachments: attachments.map(({ storage_name, thumbnail_name, uploaded_by, ...a }) => ({
      ...a,
      id: attachmentNo(a.id),
      case_id: caseNo(a.case_id),
      uploadedBy: who(uploaded_by),
      bytes: readFileSync(storage.fileFor(storage_name)).toString('base64'),
      thumbnail: thumbnail_name ? readFileSync(storage.fileFor(thumbnail_name)).toString('base64') : null,
    })),
  };
}

const counts = async (ctx: TestContext) => ({
  cases: (await ctx.db.selectFrom('cases').select('id').execute()).length,
  comments: (await ctx.db.selectFrom('comments').select('id').execute()).length,
  attachments: (await ctx.db.selectFrom('attachments').select('id').execute()).length,
  users: (await ctx.db.selectFrom('users').select('id').execute()).length,
});

/** Rewrites one JSON file of an archive and its checksum, as a hand-edited archive would be. */
function editArchive(zip: Uint8Array, name: string, edit: (records: Record<string, unknown>[]) => void): Uint8Array {
  const files = unzipSync(zip);
  const records = JSON.parse(Buffer.from(files[name]).toString('utf8'));
  edit(records);
  files[name] = Buffer.from(JSON.stringify(records));
  const manifest = JSON.parse(Buffer.from(files['casebook.json']).toString('utf8'));
  manifest.files[name] = sha(files[name]);
  files['casebook.json'] = Buffer.from(JSON.stringify(manifest));
  return zipSync(files);
}

describe('casebook export and import', () => {
  let source: TestContext;
  let target: TestContext;
  let archive: Buffer;
  beforeAll(async () => {
    [source, target] = await Promise.all([createTestContext(), createTestContext()]);
    await seedDemoCasebook(source, source.config.demoPassword);
    archive = await downloadCasebook(await signedIn(source, 'admin'));
  }, 180_000);
  afterAll(async () => {
    await source?.close();
    await target?.close();
  });

  it('should refuse export and import to anyone below admin', async () => {
    const mod = await signedIn(source, 'moderator');
    await mod.get('/api/admin/casebook/export').expect(403);
    await upload(mod, archive).expect(403);
  });

  it('should export a zip of JSON records, one Markdown page per case and the attachments', () => {
    const files = unzipSync(archive);
    for (const name of ['casebook.json', 'users.json', 'cases.json', 'revisions.json', 'comments.json', 'attachments.json', 'history.json']) {
      expect(files[name], name).toBeDefined();
    }
    const pages = Object.keys(files).filter((n) => /^cases\/\d{4}-[a-z0-9-]+\/case\.md$/.test(n));
    expect(pages).toHaveLength(JSON.parse(Buffer.from(files['cases.json']).toString()).length);
    const buck = Object.keys(files).find((n) => n.includes('buck-switch-node') && n.endsWith('case.md'))!;
    const page = Buffer.from(files[buck]).toString();
    expect(page).toContain('# Buck switch node rings at 110 MHz');
    expect(page).toMatch(/!\[gl-buck-ring-screen\.png\]\(attachments\/\d+-gl-buck-ring-screen\.png\)/);
    expect(page).toContain('| probe.groundLeadM | 150 mm |');
  });

  it('should export only the cases the filters select', async () => {
    const zip = await downloadCasebook(await signedIn(source, 'admin'), '?cause=ground-lead&status=verified');
    const cases = JSON.parse(Buffer.from(unzipSync(zip)['cases.json']).toString()) as { statedCause: string; status: string }[];
    expect(cases.length).toBeGreaterThan(0);
    for (const c of cases) expect([c.statedCause, c.status]).toEqual(['ground-lead', 'verified']);
  });

  it('should refuse a damaged archive with a clear message and change nothing', async () => {
    const admin = await signedIn(target, 'admin');
    const before = await counts(target);
    // a byte flipped inside a stored screenshot: the zip still opens, the checksum catches it
    const files = unzipSync(archive);
    const png = Object.keys(files).find((n) => n.endsWith('.png'))!;
    const at = Buffer.from(archive).indexOf(Buffer.from(files[png].subarray(100, 140)));
    const flipped = Buffer.from(archive);
    flipped[at + 5] ^= 0xff;
    const res = await upload(admin, flipped).expect(400);
    expect(res.body.error).toMatch(/damaged.*does not match its checksum.*Nothing was imported/);
    const truncated = await upload(admin, archive.subarray(0, Math.floor(archive.length / 2))).expect(415);
    expect(truncated.body.error).toMatch(/not a casebook archive.*Nothing was imported/);
    await upload(admin, Buffer.from('time_s,voltage_v\n0,1\n')).expect(415);
    expect(await counts(target)).toEqual(before);
  });

  it('should report what an edited archive holds that fails validation, and import nothing on a dry run', async () => {
    const admin = await signedIn(target, 'admin');
    const before = await counts(target);
    const edited = editArchive(archive, 'cases.json', (cases) => {
      cases[0].status = 'approved';
    });
    const res = await upload(admin, edited, '?dryRun=1').expect(200);
    const { report } = res.body;
    expect(report.dryRun).toBe(true);
    expect(report.refused).toContainEqual(expect.objectContaining({ kind: 'case', id: 1, reason: expect.stringMatching(/status: Status must be one of/) }));
    expect(report.refused.some((n: { kind: string; reason: string }) => n.kind === 'comment' && /case #1 was not imported/.test(n.reason))).toBe(true);
    expect(report.imported.cases).toBeGreaterThan(30);
    expect(await counts(target)).toEqual(before);
  });

  it('should round-trip every case, revision, comment and attachment byte for byte into an empty casebook', async () => {
    const admin = await signedIn(target, 'admin');
    const res = await upload(admin, archive).expect(200);
    const { report } = res.body;
    expect(report.refused).toEqual([]);
    expect(report.skipped).toEqual([]);
    const there = await contents(source);
    expect(report.imported.cases).toBe(there.cases.length);
    expect(report.imported.attachments).toBe(there.attachments.length);
    expect(await contents(target)).toEqual(there);
    if (ON_POSTGRES) {
      // the planner's statistics were gathered after the load (ANALYZE sets reltuples; −1 is never analysed)
      const { rows } = await sql<{ reltuples: number }>`select reltuples from pg_class where relname = 'cases' and relnamespace = 'public'::regnamespace`.execute(target.db);
      expect(Number(rows[0].reltuples)).toBe(there.cases.length);
    }
  });

  it('should skip every record already here when the same archive comes in again', async () => {
    const admin = await signedIn(target, 'admin');
    const before = await counts(target);
    const { report } = (await upload(admin, archive).expect(200)).body;
    expect(report.imported.cases).toBe(0);
    expect(report.skipped.filter((n: { kind: string }) => n.kind === 'case')).toHaveLength(before.cases);
    expect(await counts(target)).toEqual(before);
  });

  it('should add people who were not here as deactivated engineers, never with the role from the archive', async () => {
    const rhys = await target.db.selectFrom('users').selectAll().where('email', '=', 'rhys.tanaka@falsetrace.test').executeTakeFirstOrThrow();
    expect([rhys.role, rhys.active, rhys.password_hash]).toEqual(['engineer', 0, null]);
  });
});
