import { promises as fs } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { FileMigrationProvider, Migrator } from 'kysely';
import type { Db } from './database';

const migrationFolder = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../migrations');

export function createMigrator(db: Db): Migrator {
  return new Migrator({ db, provider: new FileMigrationProvider({ fs, path, migrationFolder }) });
}

/** Brings the schema to the newest migration; throws with the failing migration's name. */
export async function migrateToLatest(db: Db): Promise<void> {
  const { error, results } = await createMigrator(db).migrateToLatest();
  const failed = results?.find((r) => r.status === 'Error');
  if (error) {
    throw new Error(`migration ${failed?.migrationName ?? '(unknown)'} failed: ${String((error as Error).message ?? error)}`);
  }
}
