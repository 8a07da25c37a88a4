import { existsSync, readdirSync, rmSync } from 'node:fs';
import path from 'node:path';
import { loadConfig } from '../server/config';
import { openAppDatabase, sqliteOf } from '../server/db/database';
import { countUsers } from '../server/db/repositories/users';
import { migrateToLatest } from '../server/db/migrate';
import { seedBenchCasebook } from '../server/seed/bench/generate-cases';

// DATA_DIR=/tmp/big npm run seed:bench -- 100000 [--force] [--seed=N]
// DATABASE_URL=postgres://… npm run seed:bench -- 100000   (an empty PostgreSQL database)
const args = process.argv.slice(2);
const force = args.includes('--force');
const seedArg = args.find((a) => a.startsWith('--seed='));
const countArg = args.find((a) => /^\d[\d_]*$/.test(a));
const unknown = args.filter((a) => a !== '--force' && a !== seedArg && a !== countArg);
if (!countArg || unknown.length) {
  console.error('usage: DATA_DIR=<dir> npm run seed:bench -- <number of cases> [--force] [--seed=<n>]');
  console.error('  fills an empty DATA_DIR with that many generated cases; --force first deletes the database and search snapshot already there');
  process.exit(2);
}
const count = Number(countArg.replaceAll('_', ''));
if (!Number.isSafeInteger(count) || count < 1 || count > 2_000_000) {
  console.error(`The number of cases must be between 1 and 2,000,000, got ${countArg}`);
  process.exit(2);
}

const onPostgres = Boolean(process.env.DATABASE_URL?.trim());
const dataDir = path.resolve(process.env.DATA_DIR ?? './data');
const present = existsSync(dataDir) && !onPostgres ? readdirSync(dataDir) : [];
if (present.length > 0) {
  if (!force) {
    console.error(`${dataDir} is not empty (${present.slice(0, 5).join(', ')}${present.length > 5 ? ', …' : ''}).`);
    console.error('seed:bench only fills an empty DATA_DIR. Point DATA_DIR at a new folder, or add --force to delete the casebook in it first.');
    process.exit(1);
  }
  // only what the app owns: the database, its journal files, uploads and the search snapshot
  for (const name of present) {
    if (/^falsetrace\.sqlite(-wal|-shm|-journal)?$/.test(name) || name === 'search' || name === 'uploads') rmSync(path.join(dataDir, name), { recursive: true, force: true });
  }
  console.log(`--force: removed the casebook in ${dataDir}`);
}

const config = loadConfig();
const db = openAppDatabase(config);
await migrateToLatest(db);
if (onPostgres && (await countUsers(db)) > 0) {
  await db.destroy();
  // dropping tables in somebody's PostgreSQL database is not ours to do
  console.error('seed:bench only fills an empty database, and this one has accounts. Create a new one (createdb) and point DATABASE_URL at it.');
  process.exit(1);
}
// a throwaway file being filled: no fsync per transaction
if (!onPostgres) sqliteOf(db).pragma('synchronous = OFF');
const started = Date.now();
let reported = 0;
const seeded = await seedBenchCasebook(db, {
  count,
  password: config.demoPassword,
  seed: seedArg ? Number(seedArg.slice(7)) : undefined,
  onProgress: (done) => {
    if (done - reported >= 10_000 || done === count) {
      reported = done;
      console.log(`  ${done.toLocaleString('en')} cases, ${((Date.now() - started) / 1000).toFixed(1)} s`);
    }
  },
});
if (!onPostgres) sqliteOf(db).pragma('synchronous = NORMAL');
await db.destroy();
const states = Object.entries(seeded.byStatus).map(([k, n]) => `${n} ${k.replace('_', ' ')}`).join(', ');
console.log(`seeded ${onPostgres ? 'the PostgreSQL database' : config.dataDir}: ${seeded.people} people, ${seeded.cases} cases (${states}), ${seeded.tags} tag uses, ${seeded.comments} comments in ${((Date.now() - started) / 1000).toFixed(1)} s`);
console.log(`demo accounts sign in with the demo password; the search index is built on the first start.`);
