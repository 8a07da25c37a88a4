import { copyFileSync, cpSync, mkdirSync, readdirSync, rmSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';
import { engineRevisionFromSource } from '../server/services/engine-revision';

// npm run build:server → dist-server/: the server as plain JavaScript for `node dist-server/index.mjs`,
// so production runs without tsx or npm between the process manager's signals and the server.
const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
// BUILD_SERVER_OUT: another folder beside dist-server (tests that build while another build runs)
const out = path.join(root, process.env.BUILD_SERVER_OUT ?? 'dist-server');
rmSync(out, { recursive: true, force: true });
mkdirSync(path.join(out, 'migrations'), { recursive: true });

const common = { platform: 'node', format: 'esm', target: 'node20', packages: 'external', sourcemap: true, logLevel: 'warning' } as const;
// the bundle has no engine source beside it to fingerprint: the revision goes in as a constant
const define = { 'process.env.FALSETRACE_ENGINE_REVISION': JSON.stringify(engineRevisionFromSource()) };
await build({ ...common, entryPoints: [path.join(root, 'server/index.ts')], bundle: true, define, outfile: path.join(out, 'index.mjs') });
// the search index's thread, found by the server beside its bundle
await build({ ...common, entryPoints: [path.join(root, 'server/search/search-worker.ts')], bundle: true, outfile: path.join(out, 'search-worker.mjs') });
await build({
  ...common,
  entryPoints: readdirSync(path.join(root, 'migrations')).filter((f) => /^\d.*\.ts$/.test(f)).map((f) => path.join(root, 'migrations', f)),
  bundle: true,
  outdir: path.join(out, 'migrations'),
  outExtension: { '.js': '.js' },
});
// the capture worker, likewise
await build({ ...common, entryPoints: [path.join(root, 'server/captures/capture-worker.ts')], bundle: true, outfile: path.join(out, 'capture-worker.mjs') });
// the capture worker's second thread for large files, likewise
await build({ ...common, entryPoints: [path.join(root, 'server/captures/back-half-worker.ts')], bundle: true, outfile: path.join(out, 'back-half-worker.mjs') });
// the zip worker, likewise
await build({ ...common, entryPoints: [path.join(root, 'server/casebook/zip-worker.ts')], bundle: true, outfile: path.join(out, 'zip-worker.mjs') });
// the image worker is plain JavaScript already; its pool finds it beside the bundle
copyFileSync(path.join(root, 'server/images/reencode-worker.mjs'), path.join(out, 'reencode-worker.mjs'));
// the demo's captures, read when an empty casebook is seeded (CAPTURE_DIR, beside the bundle)
cpSync(path.join(root, 'server/seed/demo/captures'), path.join(out, 'captures'), { recursive: true });
console.log(`server built into ${path.relative(root, out)}/ (start it with: node dist-server/index.mjs)`);
