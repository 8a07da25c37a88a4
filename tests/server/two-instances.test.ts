import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import type { Config } from '../../server/config';
import type { Db } from '../../server/db/database';
import { migrateToLatest } from '../../server/db/migrate';
import { createMailQueue, type BackgroundMailQueue } from '../../server/mail/mail-queue';
import type { Mailer, MailMessage } from '../../server/mail/mailer';
import { openCaseSearch, type CaseSearch } from '../../server/search/case-search';
import { DEMO_ACCOUNTS, seedDemoUsers } from '../../server/seed/demo-users';
import { sendDigests } from '../../server/services/digest';
import { pngBytes } from './helpers/fixtures';
import { DEMO_PASSWORD, demoEmail, ON_POSTGRES, openSharedTestDatabase } from './helpers/test-context';

/**
 * Two app instances as a load balancer would see them: each its own database connection (pool),
 * search index on a worker thread following the change log, mail queue and data folder; one
 * database (a PostgreSQL database, or one SQLite file) and one UPLOADS_DIR between them.
 */

/** The promise: a write on one instance is found by search on the others within 2 s. */
const FOLLOW_BOUND_MS = 2000;

function recordingMailer() {
  const sent: MailMessage[] = [];
  const mailer: Mailer = { usesLocalFake: false, send: async (m) => void sent.push(m), close() {} };
  return { mailer, sent };
}

interface Instance {
  name: string;
  app: ReturnType<typeof createApp>;
  db: Db;
  config: Config;
  mail: BackgroundMailQueue;
  mailer: Mailer;
  sent: MailMessage[];
  search: CaseSearch;
  close(): Promise<void>;
}

async function startInstance(name: string, db: Db, work: string, uploadsDir: string): Promise<Instance> {
  const dataDir = mkdtempSync(path.join(work, `${name}-data-`));
  const config: Config = {
    port: 0,
    dataDir,
    publicUrl: 'http://falsetrace.local',
    // every instance behind the balancer is given the same SESSION_SECRET
    sessionSecret: 'shared-secret-shared-secret-shared',
    seedDemo: false,
    demoPassword: DEMO_PASSWORD,
    production: false,
    uploadsDir,
  };
  const { mailer, sent } = recordingMailer();
  const mail = createMailQueue(db, mailer, { claimer: name });
  // as the server opens it: on a worker thread, following other instances' writes every 500 ms
  const search = await openCaseSearch(db, { dataDir, worker: true, background: true });
  await search.ready;
  const app = createApp({ db, mailer, mail, config, search });
  return {
    name,
    app,
    db,
    config,
    mail,
    mailer,
    sent,
    search,
    async close() {
      mail.stop();
      await mail.idle();
      await search.close();
      (app.locals.sessionStore as { close(): void }).close();
      await db.destroy();
    },
  };
}

/** A browser's cookies, sent to whichever instance the balancer picks (the jar is not bound to one app). */
function browser() {
  const cookies = new Map<string, string>();
  let csrf = '';
  const keep = (res: request.Response) => {
    for (const c of ([] as string[]).concat(res.headers['set-cookie'] ?? [])) {
      const [pair] = c.split(';');
      const eq = pair.indexOf('=');
      cookies.set(pair.slice(0, eq), pair.slice(eq + 1));
    }
    if (cookies.has('ft.csrf')) csrf = decodeURIComponent(cookies.get('ft.csrf')!);
    return res;
  };
  const header = () => [...cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  return {
    hasSession: () => cookies.size > 0,
    async start(on: Instance) {
      const res = keep(await request(on.app).get('/api/auth/csrf').set('Cookie', header()).expect(200));
      csrf = res.body.csrfToken;
    },
    get: (on: Instance, url: string) => request(on.app).get(url).set('Cookie', header()).then(keep),
    /** The bytes of a download. */
    bytes: (on: Instance, url: string) =>
      request(on.app)
        .get(url)
        .set('Cookie', header())
        .buffer(true)
        .parse((res, done) => {
          const chunks: Buffer[] = [];
          res.on('data', (c: Buffer) => chunks.push(c));
          res.on('end', () => done(null, Buffer.concat(chunks)));
        }),
    post: (on: Instance, url: string, body?: object) => request(on.app).post(url).set('Cookie', header()).set('x-csrf-token', csrf).send(body).then(keep),
    upload: (on: Instance, url: string, bytes: Buffer, filename: string, contentType: string) =>
      request(on.app).post(url).set('Cookie', header()).set('x-csrf-token', csrf).attach('file', bytes, { filename, contentType }).then(keep),
  };
}

describe(`two app instances on one database and one UPLOADS_DIR (${ON_POSTGRES ? 'PostgreSQL' : 'SQLite file'})`, () => {
  let work: string;
  let shared: Awaited<ReturnType<typeof openSharedTestDatabase>>;
  let a: Instance;
  let b: Instance;
  const engineer = browser();

  beforeAll(async () => {
    work = mkdtempSync(path.join(tmpdir(), 'falsetrace-two-'));
    shared = await openSharedTestDatabase(work);
    const first = shared.open();
    await migrateToLatest(first);
    await seedDemoUsers(first, DEMO_PASSWORD);
    const uploadsDir = path.join(work, 'shared-uploads');
    a = await startInstance('instance-a', first, work, uploadsDir);
    b = await startInstance('instance-b', shared.open(), work, uploadsDir);
  });
  afterAll(async () => {
    await a?.close();
    await b?.close();
    await shared?.drop();
    rmSync(work, { recursive: true, force: true });
  });

  it('should keep a session made on instance A valid on instance B', async () => {
    await engineer.start(a);
    expect((await engineer.post(a, '/api/auth/login', { email: demoEmail('engineer'), password: DEMO_PASSWORD })).status).toBe(200);
    const me = await engineer.get(b, '/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe(demoEmail('engineer'));
    // and a write through B with the CSRF token A issued
    expect((await engineer.post(b, '/api/cases', { title: 'Written through B', summary: 'session from A' })).status).toBe(201);
  });

  it(`should find on instance B, within ${FOLLOW_BOUND_MS / 1000} s, a case created through instance A`, async () => {
    const created = await engineer.post(a, '/api/cases', { title: 'Numbatscope ringing on the ground lead', summary: 'Created through instance A' });
    expect(created.status).toBe(201);
    // B's index was ready before the write: the bound counts from A's answer, polled, never slept out.
    // B follows the change log every 500 ms, so the bound leaves 1.5 s for a busy machine.
    const deadline = Date.now() + FOLLOW_BOUND_MS;
    let found: number[] = [];
    while (Date.now() <= deadline) {
      const res = await engineer.get(b, '/api/search?q=numbatscope');
      expect(res.status).toBe(200);
      found = res.body.results.map((r: { id: number }) => r.id);
      if (found.length) break;
      await new Promise((r) => setTimeout(r, 50));
    }
    expect(found, `instance B did not find the case within ${FOLLOW_BOUND_MS} ms of its creation on A`).toEqual([created.body.case.id]);
  });

  it('should download through instance B an attachment uploaded through instance A', async () => {
    const id = (await engineer.post(a, '/api/cases', { title: 'Shared attachment', summary: 'uploaded on A' })).body.case.id;
    const png = await pngBytes(32, 24);
    const up = await engineer.upload(a, `/api/cases/${id}/attachments`, png, 'probe-tip.png', 'image/png');
    expect(up.status).toBe(201);
    const file = await engineer.bytes(b, `/api/attachments/${up.body.attachment.id}/file`);
    expect(file.status).toBe(200);
    expect(Buffer.compare(file.body as Buffer, png)).toBe(0);
    expect((await engineer.get(b, `/api/attachments/${up.body.attachment.id}/thumbnail`)).status).toBe(200);
  });

  it('should send each digest once when both instances run it at once', async () => {
    const users = await a.db.selectFrom('users').select(['id', 'email']).orderBy('id').execute();
    expect(users).toHaveLength(DEMO_ACCOUNTS.length);
    const at = new Date().toISOString();
    for (const u of users) await a.db.insertInto('digest_items').values({ user_id: u.id, kind: 'comment', case_id: null, line: `news for ${u.email}`, created_at: at }).execute();
    const deps = (i: Instance) => ({ db: i.db, mailer: i.mailer, mail: i.mail, config: i.config });
    if (ON_POSTGRES) await Promise.all([sendDigests(deps(a)), sendDigests(deps(b))]);
    else {
      // one thread cannot hold two SQLite write transactions; between processes the file lock
      // serialises the runs, which is what running them one after the other does here
      await sendDigests(deps(a));
      await sendDigests(deps(b));
    }
    await Promise.all([a.mail.retryDue(), b.mail.retryDue()]);
    await Promise.all([a.mail.retryDue(), b.mail.retryDue()]);
    const digests = [...a.sent, ...b.sent].filter((m) => m.subject.includes('Daily digest'));
    expect(digests.map((m) => m.to).sort()).toEqual(users.map((u) => u.email).sort());
  });
});
