import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

/**
 * Where a worker thread's code is: `<name>.mjs` beside the server bundle in production
 * (scripts/build-server.ts puts it there), else its TypeScript `source`, started through tsx by
 * worker-boot.mjs (development, tests).
 */
export function workerEntry(name: string, source: URL): { filename: string; workerData?: { entry: string } } {
  const bundled = new URL(`./${name}.mjs`, import.meta.url);
  if (existsSync(fileURLToPath(bundled))) return { filename: bundled.href };
  return { filename: new URL('./worker-boot.mjs', import.meta.url).href, workerData: { entry: source.href } };
}
