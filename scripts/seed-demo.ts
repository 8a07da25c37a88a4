import { loadConfig } from '../server/config';
import { openAppDatabase } from '../server/db/database';
import { migrateToLatest } from '../server/db/migrate';
import { countUsers } from '../server/db/repositories/users';
import { createMailQueue } from '../server/mail/mail-queue';
import type { Mailer } from '../server/mail/mailer';
import { seedDemoCasebook } from '../server/seed/demo/seed-casebook';

// DATA_DIR=/tmp/demo npm run seed:demo → a fresh DATA_DIR holding the demo casebook
const config = loadConfig();
const db = openAppDatabase(config);
await migrateToLatest(db);
if ((await countUsers(db)) > 0) {
  console.error(`${config.dataDir} already holds a casebook with people in it; seed:demo only fills a fresh DATA_DIR.`);
  await db.destroy();
  process.exit(1);
}
// the seed sends no mail; a mailer that refuses keeps it that way
const mailer: Mailer = { usesLocalFake: true, send: async () => Promise.reject(new Error('no mail while seeding')), close: () => {} };
const started = Date.now();
const seeded = await seedDemoCasebook({ db, mailer, mail: createMailQueue(db, mailer), config }, config.demoPassword);
console.log(`seeded ${config.dataDir}: ${seeded.people} people, ${seeded.cases} cases, ${seeded.attachments} attachments in ${((Date.now() - started) / 1000).toFixed(1)} s`);
await db.destroy();
