/**
 * Run in a fresh process by bench/search.ts, once per side: how long a restart takes to be
 * ready from what is on disk, and the process's resident memory for the index and after it
 * served the page mix. argv: <app|fts5> <dataDir> <stamp> <fts5 file>
 */
import v8 from 'node:v8';
import vm from 'node:vm';
import Database from 'better-sqlite3';
import { readSnapshot } from '../server/search/snapshot';
import { appPage } from './search-app-page';
import { queriesOn } from './search-fts5';
import { queryMix } from './search-queries';

v8.setFlagsFromString('--expose-gc');
const gc = vm.runInNewContext('gc') as () => void;
const [side, dataDir, stamp, ftsFile] = process.argv.slice(2);
const rss = () => {
  gc();
  gc();
  return process.memoryUsage().rss / 1e6;
};

// modules loaded and the query mix made before the baseline, so only the index is counted
const mix = queryMix();
const db = new Database(ftsFile, { readonly: true });
const fts = queriesOn(db);
const before = rss();
let t = performance.now();
let msReady: number;
let run: (i: number) => void;
if (side === 'app') {
  const index = readSnapshot(dataDir, stamp);
  if (!index) throw new Error('snapshot missing or stale');
  msReady = performance.now() - t;
  run = (i) => appPage(index, fts.rowsOf, mix[i]);
} else {
  // FTS5 is ready once the file is open: its pages come in on demand
  fts.search({ q: 'probe ', kind: 'cold', as: { role: 'moderator', id: 0 } });
  msReady = performance.now() - t;
  run = (i) => fts.page(mix[i]);
}
const ready = rss();
t = performance.now();
run(0);
const msFirst = performance.now() - t;
for (let i = 0; i < mix.length; i++) run(i);
const served = rss();
console.log(JSON.stringify({ msReady, msFirst, rssIndexMB: ready - before, rssServedMB: served - before }));
