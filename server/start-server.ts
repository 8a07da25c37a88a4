import { rmSync } from 'node:fs';
import type { Server } from 'node:http';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { createApp } from './app';
import { logger } from './logger';
import { claimDataDir } from './backup/server-lock';
import { sweepUploads } from './backup/upload-sweep';
import { captureWorkers } from './captures/capture-pool';
import { zipWorkers } from './casebook/zip-pool';
import { imageWorkers } from './images/image-pool';
import type { Config } from './config';
import { openAppDatabase } from './db/database';
import { migrateToLatest } from './db/migrate';
import { countUsers } from './db/repositories/users';
import { startLocalSmtpFake } from './mail/local-smtp-fake';
import { createMailQueue } from './mail/mail-queue';
import { resolvePasswordResetRequests } from './services/auth';
import { createMailer } from './mail/mailer';
import { rediagnoseCasebook, rediagnosisInterrupted } from './services/rediagnose';
import { snapshotPath } from './search/snapshot';
import { openCaseSearch } from './search/case-search';
import { seedDemoCasebook } from './seed/demo/seed-casebook';
import { runDailyDigestIfDue } from './services/digest';

export const CLIENT_DIR = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../dist');

/** Opens the database, migrates, seeds an empty one, starts mail and listens. */
export async function startServer(config: Config) {
  // tells `npm run restore` that this folder is in use
  const release = claimDataDir(config.dataDir);
  const db = openAppDatabase(config);
  await migrateToLatest(db);
  // a shared UPLOADS_DIR holds other instances' uploads in progress: only an hour-old leftover is a crash's
  const swept = await sweepUploads(db, { dataDir: config.dataDir, uploadsDir: config.uploadsDir }, { minAgeMs: config.uploadsDir ? 60 * 60 * 1000 : 0 });
  if (swept.partial || swept.orphaned) {
    logger.info(swept, `uploads: removed ${swept.partial} partial upload(s); moved ${swept.orphaned} file(s) no attachment names aside`);
  }

  const fake = config.smtpUrl ? undefined : await startLocalSmtpFake(db);
  const mailer = createMailer(config.smtpUrl ?? `smtp://127.0.0.1:${fake!.port}?ignoreTLS=true`, !config.smtpUrl);

  // the queue's sweep also turns password reset requests into mails
  const mail = createMailQueue(db, mailer, { prepare: (queue) => resolvePasswordResetRequests({ db, config, mail: queue }) });
  if (config.seedDemo && (await countUsers(db)) === 0) {
    const seeded = await seedDemoCasebook({ db, mailer, mail, config }, config.demoPassword);
    logger.info(seeded, `empty database: demo casebook seeded (${seeded.people} people, ${seeded.cases} cases, ${seeded.attachments} attachments)`);
  }

  mail.start();
  void mail.retryDue().catch((err) => logger.error({ err }, 'mail retry failed'));
  // after seeding, so a fresh casebook is indexed; a matching snapshot in DATA_DIR skips the rebuild
  // on its own thread and in the background: the server listens at once, searches wait for it (or 503)
  const searchStarted = performance.now();
  if (await rediagnosisInterrupted(db)) {
    // its rewrites keep their edit time, so the snapshot would still look current: build from the database
    rmSync(snapshotPath(config.dataDir), { force: true });
    logger.warn('a re-diagnosis of the stored cases was cut short: the search index is rebuilt, and the re-diagnosis runs again');
  }
  const search = await openCaseSearch(db, { dataDir: config.dataDir, worker: true, background: true });
  // a shutdown may close the worker between the load and this count: that is no error to crash on
  search.ready
    .then(async () => logger.info(`search index ${search.origin === 'snapshot' ? 'restored from snapshot' : 'built'}: ${await search.size()} cases in ${Math.round(performance.now() - searchStarted)} ms`))
    .catch(() => undefined);
  // after the index, so the warm-up does not slow the start on 2 cores
  let stopping = false;
  // stored diagnoses from an older engine are brought up to this one, once, after the index (it re-indexes what changed)
  void search.ready
    .catch(() => undefined)
    .then(() => (stopping ? null : rediagnoseCasebook({ db, search })))
    .then((done) => done && logger.info(done, `stored diagnoses brought up to this engine: ${done.updated} of ${done.checked} cases changed`))
    .catch((err) => stopping || logger.error({ err }, 're-diagnosis of the stored cases failed'));
  if (config.captureWarmUp) {
    void search.ready
      .catch(() => undefined)
      // a server stopped before its index was ready starts no worker
      .then(() => (stopping ? null : captureWorkers.keepWarm()))
      .then((ms) => ms !== null && logger.info(`capture worker warmed up in ${Math.round(ms)} ms`))
      // a shutdown during the warm-up closes the pool under it (no failure); a real one is logged, and uploads still work cold
      .catch((err) => stopping || logger.warn({ err }, 'capture worker warm-up failed'));
  }
  const app = createApp({ db, mailer, mail, config, search }, { clientDir: CLIENT_DIR });
  const digestTimer = setInterval(
    () => void runDailyDigestIfDue({ db, mailer, mail, config }).catch((err) => logger.error({ err }, 'digest failed')),
    60 * 60 * 1000,
  );
  digestTimer.unref();

  // Express 5 hands a listen error (the port is taken, no permission) to this callback
  const server: Server = await new Promise<Server>((resolve, reject) => {
    const s = app.listen(config.port, (err?: Error) => (err ? reject(err) : resolve(s)));
  }).catch(async (err: NodeJS.ErrnoException) => {
    stopping = true;
    clearInterval(digestTimer);
    mail.stop();
    await search.close();
    await captureWorkers.close();
    mailer.close();
    await fake?.close();
    await db.destroy();
    const why = err.code === 'EADDRINUSE' ? `port ${config.port} is already in use` : err.code === 'EACCES' ? `no permission to listen on port ${config.port}` : err.message;
    throw new Error(`[falsetrace] cannot listen: ${why}`, { cause: err });
  });

  /**
   * Stops taking connections, lets requests in flight finish for up to `graceMs` (then cuts
   * them), and closes everything else. Idle keep-alive connections are closed as they go idle.
   */
  async function close(graceMs = 0) {
    stopping = true;
    const closed = new Promise<void>((resolve) => server.close(() => resolve()));
    server.closeIdleConnections();
    const sweep = setInterval(() => server.closeIdleConnections(), 100);
    let timer: NodeJS.Timeout | undefined;
    const late = new Promise<'late'>((resolve) => (timer = setTimeout(() => resolve('late'), graceMs)));
    if ((await Promise.race([closed, late])) === 'late') {
      logger.warn(`requests still running after ${graceMs} ms; cutting them`);
      server.closeAllConnections();
      await closed;
    }
    clearTimeout(timer);
    clearInterval(sweep);
    (app.locals.sessionStore as { close(): void }).close();
    clearInterval(digestTimer);
    mail.stop();
    // a sweep that is talking to SMTP ends within the mailer's timeouts; the mail stays queued otherwise
    await Promise.race([mail.idle(), new Promise((r) => setTimeout(r, 2000).unref())]);
    await search.close();
    await imageWorkers.close();
    await zipWorkers.close();
    await captureWorkers.close();
    mailer.close();
    await fake?.close();
    await db.destroy();
    release();
  }
  return { server, close, db };
}
