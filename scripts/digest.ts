import { loadConfig } from '../server/config';
import { openAppDatabase } from '../server/db/database';
import { migrateToLatest } from '../server/db/migrate';
import { startLocalSmtpFake } from '../server/mail/local-smtp-fake';
import { createMailQueue } from '../server/mail/mail-queue';
import { createMailer } from '../server/mail/mailer';
import { sendDigests } from '../server/services/digest';

// npm run digest: sends today's digest now (safe to repeat: nobody gets a lesson twice)
const config = loadConfig();
const db = openAppDatabase(config);
await migrateToLatest(db);
const fake = config.smtpUrl ? undefined : await startLocalSmtpFake(db);
const mailer = createMailer(config.smtpUrl ?? `smtp://127.0.0.1:${fake!.port}?ignoreTLS=true`, !config.smtpUrl);
const mail = createMailQueue(db, mailer);
const { mails, lessons } = await sendDigests({ db, mailer, mail, config });
console.log(`digest: ${mails} mail(s) with ${lessons} lesson(s) queued`);
mailer.close();
await fake?.close();
await db.destroy();
