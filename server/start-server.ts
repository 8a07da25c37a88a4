import type { Server } from 'node:http';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { createApp } from './app';
import type { Config } from './config';
import { openDatabase } from './db/database';
import { migrateToLatest } from './db/migrate';
import { countUsers } from './db/repositories/users';
import { startLocalSmtpFake } from './mail/local-smtp-fake';
import { createMailQueue } from './mail/mail-queue';
import { createMailer } from './mail/mailer';
import { seedDemoUsers } from './seed/demo-users';
import { runDailyDigestIfDue } from './services/digest';

export const CLIENT_DIR = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../dist');

/** Opens the database, migrates, seeds an empty one, starts mail and listens. */
export async function startServer(config: Config) {
  const db = openDatabase(path.join(config.dataDir, 'falsetrace.sqlite'));
  await migrateToLatest(db);

  const fake = config.smtpUrl ? undefined : await startLocalSmtpFake(db);
  const mailer = createMailer(config.smtpUrl ?? `smtp://127.0.0.1:${fake!.port}?ignoreTLS=true`, !config.smtpUrl);

  if (config.seedDemo && (await countUsers(db)) === 0) {
    await seedDemoUsers(db, config.demoPassword);
    console.log('[falsetrace] empty database: demo accounts created');
  }

  const mail = createMailQueue(db, mailer);
  mail.start();
  void mail.retryDue();
  const app = createApp({ db, mailer, mail, config }, { clientDir: CLIENT_DIR });
  const digestTimer = setInterval(
    () => void runDailyDigestIfDue({ db, mailer, mail, config }).catch((e) => console.error('[falsetrace] digest failed:', e)),
    60 * 60 * 1000,
  );
  digestTimer.unref();

  const server: Server = await new Promise((resolve) => {
    const s = app.listen(config.port, () => resolve(s));
  });

  async function close() {
    await new Promise<void>((resolve) => server.close(() => resolve()));
    server.closeAllConnections();
    (app.locals.sessionStore as { close(): void }).close();
    clearInterval(digestTimer);
    mail.stop();
    mailer.close();
    await fake?.close();
    await db.destroy();
  }
  return { server, close, db };
}
