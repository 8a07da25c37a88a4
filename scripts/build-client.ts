import { execFileSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const inputs = ['src', 'shared', 'public', 'index.html', 'vite.config.ts', 'tailwind.config.ts', 'package-lock.json'];

function newestMtimeMs(p: string): number {
  if (!existsSync(p)) return 0;
  const st = statSync(p);
  if (!st.isDirectory()) return st.mtimeMs;
  return readdirSync(p).reduce((m, name) => Math.max(m, newestMtimeMs(path.join(p, name))), st.mtimeMs);
}

/** Runs `vite build` only when dist/ is missing or older than any client source. */
export function buildClientIfStale(): boolean {
  const builtIndex = path.join(root, 'dist', 'index.html');
  const builtAt = existsSync(builtIndex) ? statSync(builtIndex).mtimeMs : 0;
  const sourcesAt = Math.max(...inputs.map((i) => newestMtimeMs(path.join(root, i))));
  if (builtAt >= sourcesAt) return false;
  console.log('[falsetrace] building the client (dist/ is missing or stale)…');
  execFileSync(process.execPath, [path.join(root, 'node_modules', 'vite', 'bin', 'vite.js'), 'build', '--logLevel', 'warn'], {
    cwd: root,
    stdio: 'inherit',
  });
  return true;
}
