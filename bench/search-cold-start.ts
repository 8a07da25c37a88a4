/**
 * Run in a fresh process by bench/search.ts: how long a restart takes to have each index
 * ready from what is on disk, and what the restored minisearch index alone weighs.
 * argv: <dataDir> <stamp> <fts5 file>
 */
import v8 from 'node:v8';
import vm from 'node:vm';
import Database from 'better-sqlite3';
import { readSnapshot } from '../server/search/snapshot';
import { planQuery } from '../server/search/query-plan';
import { runTextQuery } from '../server/search/run-query';
import { queriesOn } from './search-fts5';

v8.setFlagsFromString('--expose-gc');
const gc = vm.runInNewContext('gc') as () => void;
const [dataDir, stamp, ftsFile] = process.argv.slice(2);

gc();
const heapBefore = process.memoryUsage();
let t = performance.now();
const index = readSnapshot(dataDir, stamp);
if (!index) throw new Error('snapshot missing or stale');
const msLoad = performance.now() - t;
t = performance.now();
runTextQuery(index, planQuery('ground lead ringing ', index, new Map()), () => true);
const msFirst = performance.now() - t;
gc();
const heapAfter = process.memoryUsage();

t = performance.now();
const db = new Database(ftsFile, { readonly: true });
const fts = queriesOn(db);
const ftsOpen = performance.now() - t;
t = performance.now();
fts.search({ q: 'ground lead ringing ', kind: 'cold', as: { role: 'moderator', id: 0 } });
const ftsFirst = performance.now() - t;

console.log(
  JSON.stringify({
    msLoad,
    msFirst,
    heapMB: (heapAfter.heapUsed - heapBefore.heapUsed) / 1e6,
    // the kept scores are typed arrays outside the JS heap: 4-byte id + 4-byte score each
    arrayBuffersMB: (index.heavy.entries * 8) / 1e6,
    ftsOpen,
    ftsFirst,
  }),
);
