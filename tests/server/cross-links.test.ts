import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { referencedCaseIds } from '../../shared/cases/case-references';
import { createMigrator, migrateToLatest } from '../../server/db/migrate';
import { createTestContext, invitedEngineer, signedIn, type TestContext } from './helpers/test-context';

type Client = Awaited<ReturnType<typeof signedIn>>;

describe('referencedCaseIds', () => {
  it('should take #123 standing alone and skip code, URLs, anchors and entities', () => {
    const text = [
      'Same fault as #12, see also (#7) and #12 again.',
      'Not these: `#31`, http://example.test/page#32, [x](#33), issue#34, &#35; #36a',
      '```',
      'scope #37',
      '```',
      'Last: #8.',
    ].join('\n');
    expect(referencedCaseIds(text)).toEqual([12, 7, 8]);
  });
});

/**
 * `#id` links and "referred to by" ask the same policy as GET /api/cases/:id: a draft by someone
 * else stays plain text for an engineer (no id, no title: the answer looks as if it did not exist),
 * while its author and the moderators get the link.
 */
describe('cross-links between cases follow the visibility policy', () => {
  let ctx: TestContext;
  let engineer: Client;
  let colleague: Client;
  let mod: Client;
  let secretDraft: number;
  let linking: number;
  let privateLinker: number;

  beforeAll(async () => {
    ctx = await createTestContext();
    engineer = await signedIn(ctx, 'engineer');
    mod = await signedIn(ctx, 'moderator');
    colleague = await invitedEngineer(ctx);
    secretDraft = (await colleague.post('/api/cases', { title: 'Colleague secret draft', summary: 'not yet public' }).expect(201)).body.case.id;
    // a verified case by the engineer naming the draft, a case number that does not exist, and itself in code
    linking = (
      await engineer
        .post('/api/cases', {
          title: 'Verified case that links',
          summary: 'links to others',
          narrative: `Compare #${secretDraft} and #99999; \`#${secretDraft}\` in code is no link.`,
          lessonSummary: 'Check the neighbours',
          lessonDetail: `As in #${secretDraft}.`,
        })
        .expect(201)
    ).body.case.id;
    await engineer.post(`/api/cases/${linking}/submit`).expect(200);
    await mod.post(`/api/cases/${linking}/review`, { action: 'verify' }).expect(200);
    // the engineer's own draft links to the verified case: only the engineer and moderators may know
    privateLinker = (await engineer.post('/api/cases', { title: 'Private linker', summary: 'a private draft', narrative: `Looks like #${linking}` }).expect(201)).body.case.id;
  });
  afterAll(() => ctx.close());

  it('should leave a draft of someone else out of an engineer\'s references, like a case that does not exist', async () => {
    const c = (await engineer.get(`/api/cases/${linking}`).expect(200)).body.case;
    expect(c.references).toEqual([]);
    expect(JSON.stringify(c.references)).not.toContain('secret');
  });

  it('should give the draft\'s author and moderators the link with its title', async () => {
    for (const reader of [colleague, mod]) {
      const c = (await reader.get(`/api/cases/${linking}`).expect(200)).body.case;
      expect(c.references).toEqual([{ id: secretDraft, title: 'Colleague secret draft' }]);
    }
  });

  it('should filter comment references the same way', async () => {
    await mod.post(`/api/cases/${linking}/comments`, { body: `Moderator note: see #${secretDraft} and #${privateLinker}` }).expect(201);
    const forEngineer = (await engineer.get(`/api/cases/${linking}/comments`).expect(200)).body.comments.at(-1);
    expect(forEngineer.references).toEqual([{ id: privateLinker, title: 'Private linker' }]);
    const forColleague = (await colleague.get(`/api/cases/${linking}/comments`).expect(200)).body.comments.at(-1);
    expect(forColleague.references).toEqual([{ id: secretDraft, title: 'Colleague secret draft' }]);
  });

  it('should filter lesson references the same way', async () => {
    const lessonOf = async (c: Client) =>
      ((await c.get('/api/lessons').expect(200)).body.groups as { lessons: { caseId: number; references: unknown[] }[] }[]).flatMap((g) => g.lessons).find((l) => l.caseId === linking)!;
    expect((await lessonOf(engineer)).references).toEqual([]);
    expect((await lessonOf(colleague)).references).toEqual([{ id: secretDraft, title: 'Colleague secret draft' }]);
  });

  it('should list the cases that link to a case only as far as the reader may open them', async () => {
    const forColleague = (await colleague.get(`/api/cases/${linking}`).expect(200)).body.case.referredBy;
    expect(forColleague).toEqual([]);
    const forEngineer = (await engineer.get(`/api/cases/${linking}`).expect(200)).body.case.referredBy;
    expect(forEngineer).toEqual([{ id: privateLinker, title: 'Private linker' }]);
    const draftForAuthor = (await colleague.get(`/api/cases/${secretDraft}`).expect(200)).body.case.referredBy;
    expect(draftForAuthor).toEqual([{ id: linking, title: 'Verified case that links' }]);
  });

  it('should fill the link table from the texts already written when the migration runs', async () => {
    const before = await ctx.db.selectFrom('case_references').selectAll().orderBy('source_case_id').orderBy('target_case_id').execute();
    expect(before.length).toBeGreaterThan(0);
    const migrator = createMigrator(ctx.db);
    // undo the saved searches and the link table, then bring them back: the links come back from the texts
    for (let i = 0; i < 2; i++) expect((await migrator.migrateDown()).error).toBeUndefined();
    await migrateToLatest(ctx.db);
    const after = await ctx.db.selectFrom('case_references').selectAll().orderBy('source_case_id').orderBy('target_case_id').execute();
    expect(after).toEqual(before);
  });

  it('should forget a link when the text no longer has it', async () => {
    const { updatedAt } = (await engineer.get(`/api/cases/${privateLinker}`).expect(200)).body.case;
    await engineer.patch(`/api/cases/${privateLinker}`, { narrative: 'No link any more', baseUpdatedAt: updatedAt }).expect(200);
    expect((await engineer.get(`/api/cases/${linking}`).expect(200)).body.case.referredBy).toEqual([]);
  });

  it('should resolve the numbers of a draft for its preview by the same policy, and refuse malformed lists', async () => {
    const ids = `${secretDraft},${linking},99999`;
    expect((await engineer.get(`/api/cases/references?ids=${ids}`).expect(200)).body.references).toEqual([{ id: linking, title: 'Verified case that links' }]);
    expect((await colleague.get(`/api/cases/references?ids=${ids}`).expect(200)).body.references.map((r: { id: number }) => r.id)).toEqual([secretDraft, linking]);
    expect((await mod.get(`/api/cases/references?ids=${ids}`).expect(200)).body.references.map((r: { id: number }) => r.id)).toEqual([secretDraft, linking]);
    const bad = await engineer.get('/api/cases/references?ids=12;DROP').expect(400);
    expect(bad.body.error).toMatch(/case numbers separated by commas/);
    await engineer.get(`/api/cases/references?ids=${Array.from({ length: 51 }, (_, i) => i + 1).join(',')}`).expect(400);
  });
});

