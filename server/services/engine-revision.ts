import { createHash } from 'node:crypto';
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const SHARED_DIR = fileURLToPath(new URL('../../shared/', import.meta.url));
/** What a stored diagnosis depends on: the engine, its input and result schemas. */
const ENGINE_SOURCES = ['diagnosis', 'schemas/diagnosis.ts', 'schemas/case.ts'];

let cached: string | null = null;

/**
 * The diagnosis engine's revision: a fingerprint of its source, so a new engine, in any way, gets
 * a new revision without anyone having to remember to bump a number (a change to a comment makes
 * one too; the re-diagnosis it starts then rewrites nothing). The server bundle has no source
 * beside it: `build:server` writes the fingerprint into it (`FALSETRACE_ENGINE_REVISION`).
 */
export function engineRevision(): string {
  cached ??= process.env.FALSETRACE_ENGINE_REVISION || engineRevisionFromSource();
  return cached;
}

/** SHA-256 over the engine's source files, in name order (16 hex digits). */
export function engineRevisionFromSource(): string {
  const files = ENGINE_SOURCES.flatMap((entry) => {
    const full = path.join(SHARED_DIR, entry);
    return entry.endsWith('.ts')
      ? [full]
      : readdirSync(full)
          .filter((name) => name.endsWith('.ts'))
          .map((name) => path.join(full, name));
  }).sort();
  const hash = createHash('sha256');
  for (const file of files) hash.update(path.relative(SHARED_DIR, file)).update('\0').update(readFileSync(file)).update('\0');
  return hash.digest('hex').slice(0, 16);
}
