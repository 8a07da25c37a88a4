import { loadConfig } from '../server/config';
import { openAppDatabase } from '../server/db/database';
import { createMigrator } from '../server/db/migrate';

// npm run migrate            → newest
// npm run migrate -- down    → undo the last one
const config = loadConfig();
const db = openAppDatabase(config);
const migrator = createMigrator(db);
const { error, results } = process.argv[2] === 'down' ? await migrator.migrateDown() : await migrator.migrateToLatest();
for (const r of results ?? []) console.log(`${r.status.padEnd(8)} ${r.direction.padEnd(5)} ${r.migrationName}`);
if (!results?.length) console.log('nothing to do: the schema is current');
await db.destroy();
if (error) {
  console.error('migration failed:', error);
  process.exit(1);
}
