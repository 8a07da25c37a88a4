import { createWriteStream, existsSync } from 'node:fs';
import { rename, rm } from 'node:fs/promises';
import path from 'node:path';
import { DATABASE_NAME, POSTGRES_BACKUP_REFUSAL, writeBackup } from '../server/backup/backup';
import { openDatabase } from '../server/db/database';

// npm run backup -- FILE     (DATA_DIR and UPLOADS_DIR as for the server; safe while the server runs)
const target = process.argv[2];
if (!target) {
  console.error('Usage: npm run backup -- FILE.zip   (backs up DATA_DIR, default ./data)');
  process.exit(2);
}
if (process.env.DATABASE_URL?.trim()) {
  console.error(`backup refused: ${POSTGRES_BACKUP_REFUSAL}`);
  process.exit(1);
}
const dataDir = path.resolve(process.env.DATA_DIR ?? './data');
const dbFile = path.join(dataDir, DATABASE_NAME);
if (!existsSync(dbFile)) {
  console.error(`There is no database at ${dbFile}; set DATA_DIR to the server's data folder`);
  process.exit(1);
}
const db = openDatabase(dbFile);
const partial = `${path.resolve(target)}.partial`;
try {
  const uploadsDir = process.env.UPLOADS_DIR?.trim() ? path.resolve(process.env.UPLOADS_DIR.trim()) : undefined;
  const manifest = await writeBackup(db, { dataDir, uploadsDir }, createWriteStream(partial));
  // only a finished archive gets the name a schedule looks for
  await rename(partial, path.resolve(target));
  const bytes = manifest.files.reduce((n, f) => n + f.bytes, 0);
  console.log(`backup written to ${path.resolve(target)}: ${manifest.files.length} files, ${(bytes / 1024 ** 2).toFixed(1)} MB before compression`);
} catch (err) {
  await rm(partial, { force: true });
  console.error(`backup failed: ${(err as Error).message}`);
  process.exitCode = 1;
} finally {
  await db.destroy();
}
