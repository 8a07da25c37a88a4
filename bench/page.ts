/**
 * npm run bench:page — what the sign-in page makes a browser download: builds the client
 * (vite build into a temporary folder, unless `-- --dist <dir>` names an existing build), reads
 * the index.html the server sends for /sign-in, and sums the gzipped sizes (zlib level 6, the
 * compression middleware's default) of the JavaScript it loads before anything is clicked: the
 * entry module and every chunk it preloads. Lazy screens are fetched only when opened.
 * Target (issue 15): ≤ 100 KB of gzipped JS.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { gzipSync } from 'node:zlib';

const TARGET_KB = 100;
const root = path.join(import.meta.dirname, '..');
const given = process.argv.indexOf('--dist');
let dist = given > 0 ? path.resolve(process.argv[given + 1]) : '';
let temporary = false;
if (!dist) {
  dist = mkdtempSync(path.join(tmpdir(), 'falsetrace-bench-page-'));
  temporary = true;
  execFileSync(process.execPath, [path.join(root, 'node_modules/vite/bin/vite.js'), 'build', '--outDir', dist, '--emptyOutDir', '--logLevel', 'warn'], { cwd: root, stdio: 'inherit' });
}

const html = readFileSync(path.join(dist, 'index.html'), 'utf8');
const scripts = [...html.matchAll(/<script[^>]+src="([^"]+\.js)"/g), ...html.matchAll(/<link[^>]+rel="modulepreload"[^>]+href="([^"]+\.js)"/g)].map((m) => m[1]);
const files = [...new Set(scripts)].map((src) => {
  const bytes = readFileSync(path.join(dist, src.replace(/^\//, '')));
  return { src, raw: bytes.length, gzip: gzipSync(bytes, { level: 6 }).length };
});
const kb = (n: number) => `${(n / 1024).toFixed(1)} KB`;
console.log('sign-in page JavaScript (loaded before any click):');
for (const f of files.sort((a, b) => b.gzip - a.gzip)) console.log(`  ${f.src.padEnd(48)} ${kb(f.raw).padStart(10)} raw ${kb(f.gzip).padStart(10)} gzipped`);
const total = files.reduce((n, f) => n + f.gzip, 0);
const raw = files.reduce((n, f) => n + f.raw, 0);
console.log(`total ${kb(raw)} raw, ${kb(total)} gzipped`);
console.log(`${total <= TARGET_KB * 1024 ? 'met    ' : 'NOT MET'}  sign-in route ≤ ${TARGET_KB} KB of gzipped JS (${kb(total)})`);
if (temporary) rmSync(dist, { recursive: true, force: true });
