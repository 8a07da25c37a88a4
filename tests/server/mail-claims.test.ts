import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Config } from '../../server/config';
import type { Db } from '../../server/db/database';
import { migrateToLatest } from '../../server/db/migrate';
import { createMailQueue } from '../../server/mail/mail-queue';
import type { Mailer, MailMessage } from '../../server/mail/mailer';
import { DEMO_ACCOUNTS, seedDemoUsers } from '../../server/seed/demo-users';
import { runDailyDigestIfDue, sendDigests } from '../../server/services/digest';
import { DEMO_PASSWORD, ON_POSTGRES, openSharedTestDatabase } from './helpers/test-context';

/** A mailer that records what it was given; each send takes a few milliseconds, so two sweeps interleave. */
function recordingMailer() {
  const sent: MailMessage[] = [];
  const mailer: Mailer = {
    usesLocalFake: false,
    async send(message) {
      await new Promise((r) => setTimeout(r, 3));
      sent.push(message);
    },
    close() {},
  };
  return { mailer, sent };
}

const config = (dataDir: string): Config => ({
  port: 0,
  dataDir,
  publicUrl: 'http://falsetrace.local',
  sessionSecret: 'test-secret-test-secret-test-secret',
  seedDemo: false,
  demoPassword: DEMO_PASSWORD,
  production: false,
});

/** Two app instances' worth of database connections, mail senders and mailers on one database. */
describe(`two instances share one mail queue and digest (${ON_POSTGRES ? 'PostgreSQL' : 'SQLite file'})`, () => {
  let dataDir: string;
  let shared: Awaited<ReturnType<typeof openSharedTestDatabase>>;
  let a: Db;
  let b: Db;

  beforeAll(async () => {
    dataDir = mkdtempSync(path.join(tmpdir(), 'falsetrace-claims-'));
    shared = await openSharedTestDatabase(dataDir);
    a = shared.open();
    await migrateToLatest(a);
    await seedDemoUsers(a, DEMO_PASSWORD);
    b = shared.open();
  });
  afterAll(async () => {
    await a?.destroy();
    await b?.destroy();
    await shared?.drop();
    rmSync(dataDir, { recursive: true, force: true });
  });

  const queueMails = async (n: number, prefix: string) => {
    const now = new Date().toISOString();
    for (let i = 0; i < n; i++) {
      await a.insertInto('mail_queue').values({ to_addr: `${prefix}-${i}@falsetrace.test`, subject: `${prefix} ${i}`, text: 't', html: '<p>t</p>', next_attempt_at: now, created_at: now }).execute();
    }
  };

  it('should give two sweeping instances disjoint mails and send every mail once', async () => {
    await queueMails(30, 'claim');
    const ma = recordingMailer();
    const mb = recordingMailer();
    const qa = createMailQueue(a, ma.mailer, { claimer: 'instance-a' });
    const qb = createMailQueue(b, mb.mailer, { claimer: 'instance-b' });
    // both sweep at once, twice (a sweep sends at most 20)
    await Promise.all([qa.retryDue(), qb.retryDue()]);
    await Promise.all([qa.retryDue(), qb.retryDue()]);
    const toA = ma.sent.map((m) => m.to);
    const toB = mb.sent.map((m) => m.to);
    expect(toA.length).toBeGreaterThan(0);
    expect(toB.length).toBeGreaterThan(0);
    expect(toA.filter((t) => toB.includes(t))).toEqual([]);
    expect([...toA, ...toB].sort()).toEqual(Array.from({ length: 30 }, (_, i) => `claim-${i}@falsetrace.test`).sort());
    const left = await a.selectFrom('mail_queue').select(['id', 'claimed_by']).where('sent_at', 'is', null).execute();
    expect(left).toEqual([]);
  });

  it('should take over a mail whose claimer died, after the claim timeout, and leave a live claim alone', async () => {
    const now = Date.now();
    const due = new Date(now - 60_000).toISOString();
    await a.insertInto('mail_queue').values([
      { to_addr: 'orphan@falsetrace.test', subject: 'claimed by a dead instance', text: 't', html: 'h', next_attempt_at: due, created_at: due, claimed_by: 'dead', claimed_at: new Date(now - 20 * 60_000).toISOString() },
      { to_addr: 'busy@falsetrace.test', subject: 'claimed by a live instance', text: 't', html: 'h', next_attempt_at: due, created_at: due, claimed_by: 'alive', claimed_at: new Date(now - 60_000).toISOString() },
    ]).execute();
    const m = recordingMailer();
    await createMailQueue(b, m.mailer, { claimTimeoutMs: 10 * 60_000 }).retryDue();
    expect(m.sent.map((x) => x.to)).toEqual(['orphan@falsetrace.test']);
    const busy = await a.selectFrom('mail_queue').selectAll().where('to_addr', '=', 'busy@falsetrace.test').executeTakeFirstOrThrow();
    expect(busy.sent_at).toBeNull();
    expect(busy.claimed_by).toBe('alive');
    await a.deleteFrom('mail_queue').where('to_addr', '=', 'busy@falsetrace.test').execute();
  });

  it('should send each digest once when both instances run it at once', async () => {
    const users = await a.selectFrom('users').select(['id', 'email']).orderBy('id').execute();
    expect(users.length).toBe(DEMO_ACCOUNTS.length);
    const at = new Date().toISOString();
    for (const u of users) {
      for (const n of [1, 2]) await a.insertInto('digest_items').values({ user_id: u.id, kind: 'comment', case_id: null, line: `line ${n} for ${u.email}`, created_at: at }).execute();
    }
    // a verified lesson nobody has had yet: its delivery row is claimed once per reader
    await a
      .insertInto('cases')
      .values({ author_id: users[0].id, title: 'A lesson to share', summary: 'summary', status: 'verified', lesson_summary: 'Check the ground lead', created_at: at, updated_at: at, verified_at: at })
      .execute();
    const ma = recordingMailer();
    const mb = recordingMailer();
    const deps = (db: Db, mailer: Mailer, name: string) => ({ db, mailer, mail: createMailQueue(db, mailer, { claimer: name }), config: config(dataDir) });
    const da = deps(a, ma.mailer, 'instance-a');
    const db2 = deps(b, mb.mailer, 'instance-b');
    if (ON_POSTGRES) {
      await Promise.all([sendDigests(da), sendDigests(db2)]);
    } else {
      // Two SQLite connections in one thread cannot both hold a write transaction: the second's
      // busy wait would block the first's thread. Between processes the file lock serialises the
      // runs; here they run one after the other, which is what that lock makes of them.
      await sendDigests(da);
      await sendDigests(db2);
    }
    await Promise.all([da.mail.retryDue(), db2.mail.retryDue()]);
    const digests = [...ma.sent, ...mb.sent].filter((m) => m.subject.includes('Daily digest'));
    expect(digests.map((m) => m.to).sort()).toEqual(users.map((u) => u.email).sort());
    for (const u of users) {
      const mail = digests.find((m) => m.to === u.email)!;
      expect(mail.text).toContain(`line 1 for ${u.email}`);
      expect(mail.text).toContain(`line 2 for ${u.email}`);
      expect(mail.text).toContain('Check the ground lead');
    }
    // and again: nothing left for anybody
    expect((await sendDigests(da)).mails).toBe(0);
  });

  it('should let one instance of several claim the daily digest run', async () => {
    const noon = new Date('2026-12-03T12:00:00Z');
    const m = recordingMailer();
    const da = { db: a, mailer: m.mailer, mail: createMailQueue(a, m.mailer), config: config(dataDir) };
    const dbb = { db: b, mailer: m.mailer, mail: createMailQueue(b, m.mailer), config: config(dataDir) };
    const ran = ON_POSTGRES ? await Promise.all([runDailyDigestIfDue(da, noon), runDailyDigestIfDue(dbb, noon)]) : [await runDailyDigestIfDue(da, noon), await runDailyDigestIfDue(dbb, noon)];
    expect(ran.filter(Boolean)).toHaveLength(1);
  });
});
