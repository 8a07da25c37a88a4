import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { inject } from 'vitest';
import type { Role } from '../../../shared/auth/roles';
import { createApp } from '../../../server/app';
import type { Config } from '../../../server/config';
import { openDatabase, openPostgres, type Db } from '../../../server/db/database';
import { migrateToLatest } from '../../../server/db/migrate';
import { listOutboxMessages } from '../../../server/db/repositories/outbox';
import { startLocalSmtpFake, type LocalSmtpFake } from '../../../server/mail/local-smtp-fake';
import { createMailQueue, type BackgroundMailQueue } from '../../../server/mail/mail-queue';
import { resolvePasswordResetRequests } from '../../../server/services/auth';
import { createMailer, type Mailer } from '../../../server/mail/mailer';
import { openCaseSearch, type CaseSearch } from '../../../server/search/case-search';
import { DEMO_ACCOUNTS, seedDemoUsers } from '../../../server/seed/demo-users';
import { createPostgresDatabase } from '../../helpers/postgres';

/** Set by the api-pg project: every test context gets a fresh database on the throwaway PostgreSQL cluster. */
export const ON_POSTGRES = process.env.FALSETRACE_TEST_DB === 'postgres';

/** A fresh database for one test context: in memory (or a file in `dataDir`) on SQLite, a new database on PostgreSQL. */
export async function openTestDatabase(dataDir: string, onDisk = false): Promise<{ db: Db; drop(): Promise<void> }> {
  if (!ON_POSTGRES) return { db: openDatabase(onDisk ? path.join(dataDir, 'falsetrace.sqlite') : ':memory:'), drop: async () => {} };
  const created = await createPostgresDatabase(inject('postgresAdminUrl'));
  return { db: openPostgres(created.url, { max: 4 }), drop: created.drop };
}

export const DEMO_PASSWORD = 'demo-probe-2026';
export const demoEmail = (role: Role) => DEMO_ACCOUNTS.find((a) => a.role === role)!.email;

/**
 * One database several "instances" open at once (each `open()` is its own connection or pool):
 * a SQLite file in `dataDir`, or a fresh PostgreSQL database.
 */
export async function openSharedTestDatabase(dataDir: string): Promise<{ open(): Db; drop(): Promise<void> }> {
  if (!ON_POSTGRES) return { open: () => openDatabase(path.join(dataDir, 'falsetrace.sqlite')), drop: async () => {} };
  const created = await createPostgresDatabase(inject('postgresAdminUrl'));
  return { open: () => openPostgres(created.url, { max: 4 }), drop: created.drop };
}

export interface TestContext {
  app: ReturnType<typeof createApp>;
  db: Db;
  mailer: Mailer;
  mail: BackgroundMailQueue;
  fake: LocalSmtpFake;
  config: Config;
  search: CaseSearch;
  close(): Promise<void>;
}

export interface TestContextOptions {
  /** Send to this SMTP server instead of the local fake (which still runs). */
  smtpUrl?: string;
  mailTimeoutsMs?: { connect: number; greeting: number; socket: number };
  /** Keep the database as a file in the data folder, as the server does (backup, crash tests). */
  onDisk?: boolean;
  /** As TRUST_PROXY would set it. */
  trustProxy?: Config['trustProxy'];
  /** As UPLOADS_DIR would set it (removed with the context). */
  uploadsDir?: string;
  /** As CAPTURE_LIMIT_BYTES would set it. */
  captureLimitBytes?: number;
}

/** A fresh world per suite: in-memory database (or a fresh PostgreSQL one, see ON_POSTGRES), migrations, demo users, a real SMTP fake. */
export async function createTestContext(options: TestContextOptions = {}): Promise<TestContext> {
  const dataDir = mkdtempSync(path.join(tmpdir(), 'falsetrace-test-'));
  const { db, drop } = await openTestDatabase(dataDir, options.onDisk);
  await migrateToLatest(db);
  await seedDemoUsers(db, DEMO_PASSWORD);
  const fake = await startLocalSmtpFake(db);
  const mailer = createMailer(options.smtpUrl ?? `smtp://127.0.0.1:${fake.port}?ignoreTLS=true`, !options.smtpUrl, options.mailTimeoutsMs);
  const config: Config = {
    port: 0,
    dataDir,
    publicUrl: 'http://falsetrace.local',
    sessionSecret: 'test-secret-test-secret-test-secret',
    seedDemo: false,
    demoPassword: DEMO_PASSWORD,
    production: false,
    trustProxy: options.trustProxy,
    uploadsDir: options.uploadsDir,
    captureLimitBytes: options.captureLimitBytes,
  };
  // the queue's sweep also turns password reset requests into mails
  const mail = createMailQueue(db, mailer, { prepare: (queue) => resolvePasswordResetRequests({ db, config, mail: queue }) });
  const search = await openCaseSearch(db, { dataDir: config.dataDir });
  const app = createApp({ db, mailer, mail, config, search });
  return {
    app,
    db,
    mailer,
    mail,
    fake,
    config,
    search,
    async close() {
      mail.stop();
      await mail.idle();
      await search.close();
      (app.locals.sessionStore as { close(): void }).close();
      mailer.close();
      await fake.close();
      await db.destroy();
      await drop();
      rmSync(config.dataDir, { recursive: true, force: true });
      if (config.uploadsDir) rmSync(config.uploadsDir, { recursive: true, force: true });
    },
  };
}

/**
 * A cookie-keeping client that sends the CSRF header on every state-changing call. Sign-in renews
 * the token (it is bound to the session), so the client takes the new one from the answer.
 */
export async function client(ctx: TestContext) {
  const agent = request.agent(ctx.app);
  const state = { token: (await agent.get('/api/auth/csrf').expect(200)).body.csrfToken as string };
  // as the browser's client does after sign-in: use the renewed token the server set as a cookie
  const adopt = (test: request.Test) =>
    test.on('response', (res: { headers?: Record<string, string | string[] | undefined> }) => {
      const cookies = ([] as string[]).concat(res.headers?.['set-cookie'] ?? []);
      const renewed = cookies.map((c) => c.match(/^ft\.csrf=([^;]+)/)?.[1]).find(Boolean);
      if (renewed) state.token = decodeURIComponent(renewed);
    });
  return {
    agent,
    get token() {
      return state.token;
    },
    get: (url: string) => agent.get(url),
    post: (url: string, body?: object) => adopt(agent.post(url).set('x-csrf-token', state.token).send(body)),
    patch: (url: string, body?: object) => agent.patch(url).set('x-csrf-token', state.token).send(body),
    put: (url: string, body?: object) => agent.put(url).set('x-csrf-token', state.token).send(body),
    del: (url: string) => agent.delete(url).set('x-csrf-token', state.token),
    upload: (url: string, bytes: Buffer, filename: string, contentType = 'application/octet-stream') =>
      agent.post(url).set('x-csrf-token', state.token).attach('file', bytes, { filename, contentType }),
    login: (email: string, password = DEMO_PASSWORD) => adopt(agent.post('/api/auth/login').set('x-csrf-token', state.token).send({ email, password })),
  };
}

/** The version a PATCH says it edits, read the way the editor does: the case as this client loads it. */
export async function updatedAtOf(c: Awaited<ReturnType<typeof client>>, caseId: number): Promise<string> {
  return (await c.get(`/api/cases/${caseId}`).expect(200)).body.case.updatedAt;
}

export async function signedIn(ctx: TestContext, role: Role) {
  const c = await client(ctx);
  await c.login(demoEmail(role)).expect(200);
  return c;
}

/** Mails the fake received for this address, after the background sender has delivered what is due. */
export async function mailsTo(ctx: TestContext, email: string) {
  await ctx.mail.flush();
  return (await listOutboxMessages(ctx.db)).filter((m) => m.to_addr.toLowerCase().includes(email.toLowerCase()));
}

/** The path of the first link to this app in a mail's text part. */
export function linkPath(text: string, publicUrl: string): string {
  const m = text.match(new RegExp(`${publicUrl.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}(/[^\\s]+)`));
  if (!m) throw new Error(`no link in mail: ${text}`);
  return m[1];
}

/** A colleague who is not in the demo: invited by the admin, signed in through the invitation link. */
export async function invitedEngineer(ctx: TestContext, email = 'second.engineer@falsetrace.test') {
  const admin = await signedIn(ctx, 'admin');
  await admin.post('/api/admin/people/invitations', { email, role: 'engineer' }).expect(201);
  const mail = (await mailsTo(ctx, email)).at(-1)!;
  const token = mail.text.match(/accept-invitation\/(\S+)/)![1];
  const colleague = await client(ctx);
  await colleague.post('/api/auth/invitations/accept', { token, name: 'Second Engineer', password: 'second-engineer-pw' }).expect(201);
  return colleague;
}
