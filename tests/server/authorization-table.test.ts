import { writeFile } from 'node:fs/promises';
import type { Test } from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { CaseStatus } from '../../shared/schemas/case';
import { insertCase } from '../../server/db/repositories/cases';
import { storagePaths } from '../../server/storage';
import { sendDigests } from '../../server/services/digest';
import { pngBytes, stepCsv } from './helpers/fixtures';
import { client, createTestContext, demoEmail, invitedEngineer, mailsTo, signedIn, type TestContext } from './helpers/test-context';

/**
 * Every route of the app × who asks × whose case × the case's state. The expectations are written
 * out here, apart from the code: engineers see verified cases and their own, moderators and admins
 * everything; authors edit drafts and sent-back cases; only the author submits, only a never-
 * submitted draft is deleted. A route missing from ROUTES fails the suite.
 */
type Who = 'anon' | 'author' | 'other' | 'moderator' | 'admin';
const WHO: Who[] = ['anon', 'author', 'other', 'moderator', 'admin'];
const STATES: CaseStatus[] = ['draft', 'in_review', 'needs_changes', 'verified', 'retired'];
type Client = Awaited<ReturnType<typeof client>>;
type Outcome = 'pass' | 'unauthenticated' | 'forbidden' | 'hidden';

interface Fixture {
  caseId: number;
  screenshotId: number;
  captureId: number;
  commentId: number;
  tag: string;
  updatedAt: string;
}

type CaseRule = 'see' | 'edit' | 'submit' | 'delete' | 'review' | 'own-comment' | 'hide' | 'moderate';
type Entry =
  | { rule: 'public' | 'engineer' | 'moderator' | 'admin'; call: (c: Client, n: number) => Test }
  | { rule: CaseRule; call: (c: Client, f: Fixture) => Test };

const staff = (w: Who) => w === 'moderator' || w === 'admin';
const visible = (w: Who, s: CaseStatus) => w === 'author' || staff(w) || (w === 'other' && s === 'verified');
/** What the policy says for a case rule; anonymous callers are always asked to sign in. */
function expected(rule: CaseRule, w: Who, s: CaseStatus): Outcome {
  if (w === 'anon') return 'unauthenticated';
  // checked before the case is looked up, so the answer says nothing about the case
  if (rule === 'review' || rule === 'moderate') return staff(w) ? 'pass' : 'forbidden';
  if (!visible(w, s)) return 'hidden';
  const allowed = {
    see: true,
    edit: staff(w) || (w === 'author' && (s === 'draft' || s === 'needs_changes')),
    submit: w === 'author',
    delete: w === 'author' && s === 'draft',
    'own-comment': w === 'author',
    hide: staff(w),
  }[rule];
  return allowed ? 'pass' : 'forbidden';
}

function outcomeOf(status: number, body: { error?: string }): Outcome {
  if (status === 401) return 'unauthenticated';
  if (status === 403) return 'forbidden';
  if (status === 404 && /No such case/.test(body?.error ?? '')) return 'hidden';
  return 'pass';
}

const ROUTES: Record<string, Entry> = {
  'GET /api/ready': { rule: 'public', call: (c) => c.get('/api/ready') },
  'GET /api/auth/csrf': { rule: 'public', call: (c) => c.get('/api/auth/csrf') },
  'GET /api/auth/me': { rule: 'public', call: (c) => c.get('/api/auth/me') },
  'POST /api/auth/login': { rule: 'public', call: (c) => c.post('/api/auth/login', {}) },
  'POST /api/auth/logout': { rule: 'public', call: (c) => c.post('/api/auth/logout') },
  'GET /api/auth/invitations/:token': { rule: 'public', call: (c) => c.get('/api/auth/invitations/no-such-token-000000000000') },
  'POST /api/auth/invitations/accept': { rule: 'public', call: (c) => c.post('/api/auth/invitations/accept', {}) },
  'POST /api/auth/password-reset': { rule: 'public', call: (c) => c.post('/api/auth/password-reset', {}) },
  'POST /api/auth/password-reset/confirm': { rule: 'public', call: (c) => c.post('/api/auth/password-reset/confirm', {}) },
  'PATCH /api/profile/': { rule: 'engineer', call: (c) => c.patch('/api/profile', {}) },
  'POST /api/profile/password': { rule: 'engineer', call: (c) => c.post('/api/profile/password', {}) },
  'GET /api/profile/notifications': { rule: 'engineer', call: (c) => c.get('/api/profile/notifications') },
  'PUT /api/profile/notifications': { rule: 'engineer', call: (c) => c.put('/api/profile/notifications', { prefs: {} }) },
  'GET /api/profile/watches': { rule: 'engineer', call: (c) => c.get('/api/profile/watches') },
  'GET /api/profile/saved-searches/': { rule: 'engineer', call: (c) => c.get('/api/profile/saved-searches') },
  'POST /api/profile/saved-searches/': { rule: 'engineer', call: (c) => c.post('/api/profile/saved-searches', {}) },
  'DELETE /api/profile/saved-searches/:id': { rule: 'engineer', call: (c) => c.del('/api/profile/saved-searches/999999') },
  'GET /api/admin/people/': { rule: 'admin', call: (c) => c.get('/api/admin/people') },
  'POST /api/admin/people/invitations': { rule: 'admin', call: (c) => c.post('/api/admin/people/invitations', {}) },
  'PATCH /api/admin/people/:id': { rule: 'admin', call: (c) => c.patch('/api/admin/people/1', {}) },
  'GET /api/admin/casebook/export': { rule: 'admin', call: (c) => c.get('/api/admin/casebook/export?tag=no-such-tag') },
  'POST /api/admin/casebook/import': { rule: 'admin', call: (c) => c.post('/api/admin/casebook/import?dryRun=1') },
  'GET /api/admin/backup/': { rule: 'admin', call: (c) => c.get('/api/admin/backup') },
  'GET /api/dev/outbox/': { rule: 'admin', call: (c) => c.get('/api/dev/outbox') },
  'GET /api/cases/': { rule: 'engineer', call: (c) => c.get('/api/cases') },
  'GET /api/cases/authors': { rule: 'engineer', call: (c) => c.get('/api/cases/authors') },
  'GET /api/cases/references': { rule: 'engineer', call: (c) => c.get('/api/cases/references?ids=1,2') },
  'POST /api/cases/': { rule: 'engineer', call: (c) => c.post('/api/cases', {}) },
  'GET /api/cases/:id': { rule: 'see', call: (c, f) => c.get(`/api/cases/${f.caseId}`) },
  'PATCH /api/cases/:id': { rule: 'edit', call: (c, f) => c.patch(`/api/cases/${f.caseId}`, { summary: 'edited in the table', baseUpdatedAt: f.updatedAt }) },
  'DELETE /api/cases/:id': { rule: 'delete', call: (c, f) => c.del(`/api/cases/${f.caseId}`) },
  'POST /api/cases/:id/submit': { rule: 'submit', call: (c, f) => c.post(`/api/cases/${f.caseId}/submit`) },
  'POST /api/cases/:id/attachments': { rule: 'edit', call: (c, f) => c.upload(`/api/cases/${f.caseId}/attachments`, stepCsv(50), 'a.csv', 'text/csv') },
  'DELETE /api/cases/:id/attachments/:attachmentId': { rule: 'edit', call: (c, f) => c.del(`/api/cases/${f.caseId}/attachments/${f.captureId}`) },
  'POST /api/cases/:id/review': { rule: 'review', call: (c, f) => c.post(`/api/cases/${f.caseId}/review`, { action: 'retire', note: 'table check' }) },
  'POST /api/cases/:id/watch': { rule: 'see', call: (c, f) => c.post(`/api/cases/${f.caseId}/watch`) },
  // removes only the caller's own watch row, whatever the case
  'DELETE /api/cases/:id/watch': { rule: 'engineer', call: (c) => c.del('/api/cases/999999/watch') },
  'GET /api/cases/:id/history': { rule: 'see', call: (c, f) => c.get(`/api/cases/${f.caseId}/history`) },
  'GET /api/cases/:id/revisions': { rule: 'see', call: (c, f) => c.get(`/api/cases/${f.caseId}/revisions`) },
  'GET /api/cases/:id/revisions/diff': { rule: 'see', call: (c, f) => c.get(`/api/cases/${f.caseId}/revisions/diff?from=1&to=2`) },
  'GET /api/cases/:id/comments': { rule: 'see', call: (c, f) => c.get(`/api/cases/${f.caseId}/comments`) },
  'POST /api/cases/:id/comments': { rule: 'see', call: (c, f) => c.post(`/api/cases/${f.caseId}/comments`, { body: 'table comment' }) },
  'GET /api/cases/:id/similar': { rule: 'see', call: (c, f) => c.get(`/api/cases/${f.caseId}/similar`) },
  'GET /api/search/': { rule: 'engineer', call: (c) => c.get('/api/search?q=probe') },
  'PATCH /api/comments/:id': { rule: 'own-comment', call: (c, f) => c.patch(`/api/comments/${f.commentId}`, { body: 'edited comment' }) },
  'DELETE /api/comments/:id': { rule: 'own-comment', call: (c, f) => c.del(`/api/comments/${f.commentId}`) },
  'POST /api/comments/:id/hide': { rule: 'hide', call: (c, f) => c.post(`/api/comments/${f.commentId}/hide`, { hidden: true }) },
  'GET /api/attachments/:id/file': { rule: 'see', call: (c, f) => c.get(`/api/attachments/${f.screenshotId}/file`) },
  'GET /api/attachments/:id/thumbnail': { rule: 'see', call: (c, f) => c.get(`/api/attachments/${f.screenshotId}/thumbnail`) },
  'GET /api/attachments/:id/trace': { rule: 'see', call: (c, f) => c.get(`/api/attachments/${f.captureId}/trace`) },
  'PATCH /api/attachments/:id/capture': { rule: 'edit', call: (c, f) => c.patch(`/api/attachments/${f.captureId}/capture`, { role: 'before' }) },
  'POST /api/diagnosis/': { rule: 'engineer', call: (c) => c.post('/api/diagnosis', {}) },
  'POST /api/captures/analyze': { rule: 'engineer', call: (c) => c.upload('/api/captures/analyze', stepCsv(50), 'a.csv', 'text/csv') },
  'GET /api/review/queue': { rule: 'moderator', call: (c) => c.get('/api/review/queue') },
  'GET /api/review/count': { rule: 'moderator', call: (c) => c.get('/api/review/count') },
  'GET /api/lessons/': { rule: 'engineer', call: (c) => c.get('/api/lessons') },
  'POST /api/lessons/:caseId/pin': { rule: 'moderate', call: (c, f) => c.post(`/api/lessons/${f.caseId}/pin`, { pinned: false }) },
  'PUT /api/lessons/checklist': { rule: 'moderator', call: (c) => c.put('/api/lessons/checklist', { caseIds: [] }) },
  'GET /api/tags/': { rule: 'engineer', call: (c) => c.get('/api/tags') },
  'POST /api/tags/:tag/rename': { rule: 'moderator', call: (c, n) => c.post(`/api/tags/cur-${n}/rename`, { to: `cur-${n}-renamed` }) },
  'POST /api/tags/:tag/merge': { rule: 'moderator', call: (c, n) => c.post(`/api/tags/mrg-${n}/merge`, { into: `mrg-${n}-into` }) },
  'PUT /api/tags/:tag/synonyms': { rule: 'moderator', call: (c, n) => c.put(`/api/tags/syn-${n}/synonyms`, { synonyms: [`syn-${n}-alias`] }) },
  'POST /api/tags/:tag/retire': { rule: 'moderator', call: (c, n) => c.post(`/api/tags/ret-${n}/retire`, { retired: false }) },
  'POST /api/tags/:tag/watch': { rule: 'engineer', call: (c, n) => c.post(`/api/tags/w-${n}/watch`) },
  'DELETE /api/tags/:tag/watch': { rule: 'engineer', call: (c, n) => c.del(`/api/tags/w-${n}/watch`) },
};

/** "METHOD /mount/path" of every route, read from Express's router stack. */
function routeTable(app: TestContext['app']): string[] {
  const out: string[] = [];
  const walk = (stack: { route?: { path: string; methods: Record<string, boolean> }; handle?: { stack?: unknown[] }; rawPath?: string }[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) for (const m of Object.keys(layer.route.methods)) out.push(`${m.toUpperCase()} ${prefix}${layer.route.path}`);
      else if (layer.handle?.stack) walk(layer.handle.stack as typeof stack, `${prefix}${layer.rawPath ?? ''}`);
    }
  };
  walk((app as unknown as { router: { stack: Parameters<typeof walk>[0] } }).router.stack, '');
  return out.filter((r) => r.includes(' /api/') && r !== 'GET /api/health').sort();
}

describe('authorization: every route × role × ownership × case state', () => {
  let ctx: TestContext;
  const clients = {} as Record<Who, Client>;
  let authorId: number;
  let n = 0;
  let png: Buffer;

  beforeAll(async () => {
    ctx = await createTestContext();
    clients.anon = await client(ctx);
    clients.author = await signedIn(ctx, 'engineer');
    clients.moderator = await signedIn(ctx, 'moderator');
    clients.admin = await signedIn(ctx, 'admin');
    clients.other = await invitedEngineer(ctx, 'table.other@falsetrace.test');
    authorId = (await ctx.db.selectFrom('users').select('id').where('email', '=', demoEmail('engineer')).executeTakeFirstOrThrow()).id;
    png = await pngBytes(32, 32);
  });
  afterAll(() => ctx.close());

  /** A case by the author in the given state, with a screenshot, a capture, a comment and its own tag. */
  async function fixture(status: CaseStatus): Promise<Fixture> {
    const k = ++n;
    const now = new Date().toISOString();
    const storage = storagePaths(ctx.config);
    const { id } = await insertCase(ctx.db, {
      author_id: authorId, title: `Table case ${k}`, summary: 'probe ground lead ringing', status, diagnosis: null, engine_cause: null, cause: null,
      stated_cause: null, stated_cause_other: null, fix: null, lesson_summary: status === 'verified' ? 'a lesson' : null, lesson_detail: null,
      review_note: null, duplicate_of: null, retired_reason: null, created_at: now, updated_at: now,
      submitted_at: status === 'draft' ? null : now, verified_at: status === 'verified' ? now : null,
    });
    const tag = `tbl-${k}`;
    await ctx.db.insertInto('case_tags').values({ case_id: id, tag, source: 'author' }).execute();
    await writeFile(storage.fileFor(`s${k}.png`), png);
    await writeFile(storage.fileFor(`c${k}.csv`), stepCsv(50));
    const base = { case_id: id, uploaded_by: authorId, width: null, height: null, analysis: null, created_at: now, thumbnail_name: null };
    const shot = await ctx.db.insertInto('attachments').values({ ...base, kind: 'screenshot', storage_name: `s${k}.png`, thumbnail_name: `s${k}.png`, original_name: 's.png', content_type: 'image/png', size_bytes: png.length }).returning('id').executeTakeFirstOrThrow();
    const cap = await ctx.db.insertInto('attachments').values({ ...base, kind: 'capture', storage_name: `c${k}.csv`, original_name: 'c.csv', content_type: 'text/csv; charset=utf-8', size_bytes: 1 }).returning('id').executeTakeFirstOrThrow();
    const comment = await ctx.db.insertInto('comments').values({ case_id: id, author_id: authorId, body: 'author comment', created_at: now, updated_at: now }).returning('id').executeTakeFirstOrThrow();
    await ctx.search.syncCase(id);
    return { caseId: id, screenshotId: shot.id, captureId: cap.id, commentId: comment.id, tag, updatedAt: now };
  }

  it('should have an entry for every route, and no entry for a route that is gone', () => {
    const actual = routeTable(ctx.app);
    expect(actual.length).toBeGreaterThan(40);
    expect(actual.filter((r) => !(r in ROUTES))).toEqual([]);
    expect(Object.keys(ROUTES).filter((r) => !actual.includes(r))).toEqual([]);
  });

  it('should answer every case route as the policy says, for every role, ownership and state', async () => {
    const wrong: string[] = [];
    for (const [route, entry] of Object.entries(ROUTES)) {
      if (entry.rule === 'public' || entry.rule === 'engineer' || entry.rule === 'moderator' || entry.rule === 'admin') continue;
      const call = entry.call as (c: Client, f: Fixture) => Test;
      const rule = entry.rule;
      for (const state of STATES) {
        for (const who of WHO) {
          const f = await fixture(state);
          const res = await call(clients[who], f);
          const got = outcomeOf(res.status, res.body);
          const want = expected(rule, who, state);
          if (got !== want) wrong.push(`${route} as ${who} on a ${state} case: ${got} (${res.status} ${res.body?.error ?? ''}), expected ${want}`);
        }
      }
    }
    expect(wrong).toEqual([]);
  }, 120_000);

  it('should keep /metrics (outside /api) to its bearer token: no session opens it, and it is off here', async () => {
    // the token cases are in ops-routes.test.ts; a session of any role is never enough
    for (const who of WHO) expect((await clients[who].get('/metrics')).status).toBe(404);
  });

  it('should answer every other route by role', async () => {
    const rank: Record<Who, number> = { anon: 0, author: 1, other: 1, moderator: 2, admin: 3 };
    const need = { engineer: 1, moderator: 2, admin: 3 } as const;
    const wrong: string[] = [];
    for (const [route, entry] of Object.entries(ROUTES)) {
      if (entry.rule === 'public') {
        const res = await (entry.call as (c: Client, n: number) => Test)(await client(ctx), ++n);
        if (res.status === 401 || res.status === 403) wrong.push(`${route} as anon: ${res.status}`);
        continue;
      }
      if (!(entry.rule in need)) continue;
      for (const who of WHO) {
        const res = await (entry.call as (c: Client, n: number) => Test)(clients[who], ++n);
        const want: Outcome = rank[who] === 0 ? 'unauthenticated' : rank[who] < need[entry.rule as keyof typeof need] ? 'forbidden' : 'pass';
        const got = outcomeOf(res.status, res.body);
        if (got !== want) wrong.push(`${route} as ${who}: ${got} (${res.status} ${res.body?.error ?? ''}), expected ${want}`);
      }
    }
    expect(wrong).toEqual([]);
  }, 60_000);

  it('should show a case in tags, facets, notifications and the digest exactly to those who may see it', async () => {
    const wrong: string[] = [];
    await ctx.db.deleteFrom('watches').execute();
    for (const state of STATES) {
      const f = await fixture(state);
      for (const who of ['author', 'other', 'moderator', 'admin'] as const) {
        const see = visible(who, state);
        const tags = ((await clients[who].get('/api/tags')).body.tags as { tag: string }[]).map((t) => t.tag);
        if (tags.includes(f.tag) !== see) wrong.push(`tags as ${who} on ${state}: listed=${!see}`);
        const facets = (await clients[who].get(`/api/search?q=${encodeURIComponent('probe ground lead')}&pageSize=50`)).body.facets as { tags: Record<string, number> };
        if ((f.tag in (facets?.tags ?? {})) !== see && Object.keys(facets?.tags ?? {}).length < 30) wrong.push(`facets as ${who} on ${state}: counted=${!see}`);
      }
    }
    // notifications and digest: everyone watches one tag, then a comment lands on a case in each state
    for (const who of ['other', 'moderator', 'admin'] as const) await clients[who].post('/api/tags/notify-all/watch').expect(200);
    await clients.other.put('/api/profile/notifications', { prefs: { comment: 'digest' } }).expect(200);
    for (const state of STATES) {
      const f = await fixture(state);
      await ctx.db.insertInto('case_tags').values({ case_id: f.caseId, tag: 'notify-all', source: 'author' }).execute();
      await ctx.db.updateTable('cases').set({ title: `Notify ${state} case` }).where('id', '=', f.caseId).execute();
      await clients.author.post(`/api/cases/${f.caseId}/comments`, { body: 'a comment for the watchers' }).expect(201);
    }
    await sendDigests({ db: ctx.db, mailer: ctx.mailer, mail: ctx.mail, config: ctx.config });
    for (const [who, email] of [['other', 'table.other@falsetrace.test'], ['moderator', demoEmail('moderator')], ['admin', demoEmail('admin')]] as const) {
      const text = (await mailsTo(ctx, email)).map((m) => `${m.subject}\n${m.text}`).join('\n');
      for (const state of STATES) {
        const told = text.includes(`Notify ${state} case`);
        if (who !== 'other' && told !== visible(who, state)) wrong.push(`mail to ${who} about a ${state} case: ${told}`);
      }
    }
    const digest = (await mailsTo(ctx, 'table.other@falsetrace.test')).filter((m) => m.subject.includes('Daily digest')).map((m) => m.text).join('\n');
    const lines = digest.split('\n').filter((l) => l.includes('New comment by'));
    if (lines.length !== 1) wrong.push(`digest for the other engineer has ${lines.length} comment lines, expected 1 (the verified case)`);
    expect(wrong).toEqual([]);
  }, 60_000);
});
