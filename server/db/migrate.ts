import { existsSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { Migrator, type Migration, type MigrationProvider } from 'kysely';
import type { Db } from './database';

const here = path.dirname(fileURLToPath(import.meta.url));
// the compiled server (dist-server/) carries its migrations as .js beside it; the sources are ../../migrations
const migrationFolder = [path.join(here, 'migrations'), path.resolve(here, '../../migrations')].find((d) => existsSync(d))!;

/**
 * Reads migrations/<timestamp>_<what>.ts. Our own import() rather than Kysely's
 * FileMigrationProvider, so the loader that runs this file (tsx, vitest) also loads them.
 */
class MigrationFolderProvider implements MigrationProvider {
  async getMigrations(): Promise<Record<string, Migration>> {
    const migrations: Record<string, Migration> = {};
    for (const file of readdirSync(migrationFolder).filter((f) => /^\d.*\.[jt]s$/.test(f) && !f.endsWith('.d.ts')).sort()) {
      const mod = (await import(pathToFileURL(path.join(migrationFolder, file)).href)) as Migration;
      migrations[file.replace(/\.[jt]s$/, '')] = mod;
    }
    return migrations;
  }
}

export function createMigrator(db: Db): Migrator {
  return new Migrator({ db, provider: new MigrationFolderProvider() });
}

/** Brings the schema to the newest migration; throws with the failing migration's name. */
export async function migrateToLatest(db: Db): Promise<void> {
  const { error, results } = await createMigrator(db).migrateToLatest();
  const failed = results?.find((r) => r.status === 'Error');
  if (error) {
    throw new Error(`migration ${failed?.migrationName ?? '(unknown)'} failed: ${String((error as Error).message ?? error)}`);
  }
}
