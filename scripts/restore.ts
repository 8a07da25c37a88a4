import path from 'node:path';
import { restoreBackup } from '../server/backup/restore';

// DATA_DIR=/srv/falsetrace [UPLOADS_DIR=/shared/uploads] npm run restore -- FILE.zip    (with every server stopped)
const archive = process.argv[2];
if (!archive || !process.env.DATA_DIR) {
  console.error('Usage: DATA_DIR=/path/to/data npm run restore -- BACKUP.zip   (stop the server first)');
  process.exit(2);
}
if (process.env.DATABASE_URL?.trim()) {
  console.error('restore refused: this restores the SQLite database of a built-in backup; with DATABASE_URL set, restore PostgreSQL with pg_restore and copy the uploads directory back instead');
  process.exit(1);
}
const dataDir = path.resolve(process.env.DATA_DIR);
const uploadsDir = process.env.UPLOADS_DIR?.trim() ? path.resolve(process.env.UPLOADS_DIR.trim()) : undefined;
try {
  const result = await restoreBackup(path.resolve(archive), { dataDir, uploadsDir });
  console.log(`restored ${result.files} files from ${result.manifest.createdAt} into ${dataDir}`);
  if (result.asideDir) console.log(`the folder's previous files are kept in ${result.asideDir}; delete it once the restore is checked`);
  if (result.uploadsAsideDir) console.log(`the uploads folder's previous files are kept in ${result.uploadsAsideDir}`);
} catch (err) {
  console.error(`restore refused: ${(err as Error).message}`);
  process.exit(1);
}
