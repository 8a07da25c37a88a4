import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { downloadCasebook } from './helpers/casebook-download';
import { createTestContext, signedIn, type TestContext } from './helpers/test-context';


describe('casebook import and #id links', () => {
  let source: TestContext;
  let target: TestContext;

  beforeAll(async () => {
    [source, target] = await Promise.all([createTestContext(), createTestContext()]);
  });
  afterAll(async () => {
    await source?.close();
    await target?.close();
  });

  it('should renumber the links of imported write-ups and comments to the ids here, record them, and unlink numbers it cannot place', async () => {
    const eng = await signedIn(source, 'engineer');
    const a = (await eng.post('/api/cases', { title: 'Linked source case A', summary: 'the first of two' }).expect(201)).body.case.id as number;
    const b = (
      await eng.post('/api/cases', { title: 'Linked source case B', summary: 'the second', narrative: `Same clip lead as #${a}; see also #987654. In code: \`#${a}\` stays.` }).expect(201)
    ).body.case.id as number;
    await eng.post(`/api/cases/${a}/comments`, { body: `Follow-up in #${b}` }).expect(201);
    const archive = await downloadCasebook(await signedIn(source, 'admin'));

    // the target's own cases take the archive's numbers first
    const own = await signedIn(target, 'engineer');
    for (const title of ['Own one', 'Own two', 'Own three']) await own.post('/api/cases', { title, summary: 'written here' }).expect(201);
    const admin = await signedIn(target, 'admin');
    const { report } = (await admin.upload('/api/admin/casebook/import', archive, 'casebook.zip', 'application/zip').expect(200)).body;
    expect(report.notes.join(' ')).toMatch(/#987654.*archive case N/);

    const idOf = async (title: string) => (await target.db.selectFrom('cases').select('id').where('title', '=', title).executeTakeFirstOrThrow()).id;
    const [newA, newB] = [await idOf('Linked source case A'), await idOf('Linked source case B')];
    expect([newA, newB]).not.toEqual([a, b]);
    const mod = await signedIn(target, 'moderator');
    const caseB = (await mod.get(`/api/cases/${newB}`).expect(200)).body.case;
    expect(caseB.narrative).toBe(`Same clip lead as #${newA}; see also archive case 987654. In code: \`#${a}\` stays.`);
    expect(caseB.references.map((r: { id: number }) => r.id)).toEqual([newA]);
    const caseA = (await mod.get(`/api/cases/${newA}`).expect(200)).body.case;
    expect(caseA.referredBy.map((r: { id: number }) => r.id)).toEqual([newB]);
    const comments = await target.db.selectFrom('comments').select('body').where('case_id', '=', newA).execute();
    expect(comments.map((c) => c.body)).toEqual([`Follow-up in #${newB}`]);
    const commentLinks = await target.db.selectFrom('case_references').selectAll().where('source_case_id', '=', newA).execute();
    expect(commentLinks.map((l) => [l.target_case_id, l.comment_id !== null])).toEqual([[newB, true]]);
  });
});
