import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readdirSync, renameSync, rmSync, statSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { createRequire } from 'node:module';

/**
 * Where a worker thread's code is: `<name>.mjs` beside the server bundle in production
 * (scripts/build-server.ts puts it there), else its TypeScript `source`, started through tsx by
 * worker-boot.mjs (development, tests).
 *
 * `selfContained`: in development the source is bundled into one JavaScript file instead (by
 * esbuild, into the temp directory, named by its content), for a worker that should stay light:
 * a thread started through tsx carries its loader, tens of MB of resident memory. The packages
 * it imports go into the bundle too (it lies outside the project). Only for sources that find no
 * file beside themselves through `import.meta.url`.
 */
export function workerEntry(name: string, source: URL, options: { selfContained?: boolean } = {}): { filename: string; workerData?: { entry: string } } {
  const bundled = new URL(`./${name}.mjs`, import.meta.url);
  if (existsSync(fileURLToPath(bundled))) return { filename: bundled.href };
  if (options.selfContained) return { filename: bundleInTemp(name, fileURLToPath(source)) };
  return { filename: new URL('./worker-boot.mjs', import.meta.url).href, workerData: { entry: source.href } };
}

function bundleInTemp(name: string, sourceFile: string): string {
  // esbuild's own program, not its API: loading that into this thread would cost its memory for good
  const esbuild = createRequire(import.meta.url).resolve('esbuild/bin/esbuild');
  const args = [sourceFile, '--bundle', '--platform=node', '--format=esm', '--target=node20', '--log-level=error'];
  const code = execFileSync(esbuild, args, { encoding: 'utf8', maxBuffer: 1 << 26 });
  const dir = path.join(tmpdir(), 'falsetrace-workers');
  const file = path.join(dir, `${name}-${createHash('sha256').update(code).digest('hex').slice(0, 16)}.mjs`);
  if (!existsSync(file)) {
    mkdirSync(dir, { recursive: true });
    // written aside and renamed: another process may be starting the same worker
    const scratch = `${file}.${process.pid}-${Date.now()}`;
    writeFileSync(scratch, code);
    renameSync(scratch, file);
    removeOldBundles(dir, name, file);
  } else {
    // its time says when it was last used, so that another checkout's tidying leaves it
    const now = new Date();
    utimesSync(file, now, now);
  }
  return file;
}

/** Bundles older than this are removed when a new one is written: no process still starts from them. */
const OLD_BUNDLE_MS = 24 * 60 * 60 * 1000;

/**
 * Removes earlier bundles of the same worker (each code change writes one under a new name) and
 * scratch files a crash left, once unused for a day: a process started in the last day (from
 * another checkout, say) may still start threads from its own.
 */
export function removeOldBundles(dir: string, name: string, keep: string): void {
  const now = Date.now();
  for (const entry of readdirSync(dir)) {
    const file = path.join(dir, entry);
    if (!entry.startsWith(`${name}-`) || file === keep) continue;
    try {
      if (now - statSync(file).mtimeMs > OLD_BUNDLE_MS) rmSync(file, { force: true });
    } catch {
      // gone already (another process tidied up): nothing to do
    }
  }
}
