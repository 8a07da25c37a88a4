import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, signedIn, type TestContext } from './helpers/test-context';

// A right-to-left override (U+202E) would show "Gate drive exe.gnp" as "Gate drive png.exe".
// source: Unicode Standard Annex #9, table 4
const RLO = '\u202e';

describe('titles and names without control or bidi-override characters', () => {
  let ctx: TestContext;
  let author: Awaited<ReturnType<typeof signedIn>>;

  beforeAll(async () => {
    ctx = await createTestContext();
    author = await signedIn(ctx, 'engineer');
  });
  afterAll(() => ctx.close());

  it('a case title with U+202E comes back without it, on create and on edit', async () => {
    const created = await author.post('/api/cases', { title: `Gate drive ${RLO}exe.gnp`, summary: `Read 1.2 V\u0007 instead of 12 V` }).expect(201);
    expect(created.body.case.title).toBe('Gate drive exe.gnp');
    expect(created.body.case.summary).toBe('Read 1.2 V instead of 12 V');
    const id = created.body.case.id;

    const patched = await author
      .patch(`/api/cases/${id}`, { title: `Ground lead ${RLO}ringing\u2066`, tags: [`gate${RLO}-drive`], baseUpdatedAt: created.body.case.updatedAt })
      .expect(200);
    expect(patched.body.case.title).toBe('Ground lead ringing');

    const read = await author.get(`/api/cases/${id}`).expect(200);
    expect(read.body.case.title).toBe('Ground lead ringing');
    expect(read.body.case.tags).toEqual(['gate-drive']);
  });

  it('a profile name with control and bidi characters is stored without them', async () => {
    const res = await author.patch('/api/profile', { name: `Ada\u0000 ${RLO}Probe\u202c` }).expect(200);
    expect(res.body.user.name).toBe('Ada Probe');
  });
});
