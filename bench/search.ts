/**
 * npm run bench:search — the search page the API serves against an SQLite FTS5 page doing the
 * same work (query, total, facets by cause/status/tag, highlights of the shown 20), over the
 * same generated cases, in the same run, at 10,000 and 100,000 cases (BENCH_SIZES=10000,100000).
 *
 * For each size: index time; start-up to ready from disk and resident memory (RSS) of each
 * side, each measured in a fresh process; page p50/p95 over a fixed mix of 200 queries, run
 * interleaved (one side then the other, the order swapped every round) and each query's time
 * the median over the rounds, so other work on a shared machine lands on both sides alike;
 * and nDCG@5 on a judged set (bench/search-judged.ts) for the app and for plain FTS5 BM25.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { CaseIndex } from '../server/search/case-index';
import { indexStamp, snapshotPath, writeSnapshot } from '../server/search/snapshot';
import { appPage } from './search-app-page';
import { buildFts5 } from './search-fts5';
import { judgedCorpus, judgeQueries, meanOf } from './search-judged-run';
import { queryMix } from './search-queries';

const mb = (x: number) => `${x.toFixed(0)} MB`;
const ms = (x: number) => `${x < 10 ? x.toFixed(2) : x.toFixed(0)} ms`;
const quantile = (xs: number[], q: number) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.floor(q * s.length))];
};
const median = (xs: number[]) => quantile(xs, 0.5);
const time = <T>(f: () => T): [T, number] => {
  const t = performance.now();
  const r = f();
  return [r, performance.now() - t];
};

const SIZES = (process.env.BENCH_SIZES ?? '10000,100000').split(',').map(Number);
const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 3);
console.log(`search benchmark: ${SIZES.join(' and ')} generated cases, 200 queries × ${ROUNDS} rounds, node ${process.version}`);

const ratios: string[] = [];
for (const count of SIZES) {
  const { judgedCount, rows, entries, titleOf } = judgedCorpus(count);

  const index = new CaseIndex();
  const [, msIndex] = time(() => index.addAll(entries));
  const dir = mkdtempSync(path.join(tmpdir(), 'falsetrace-bench-search-'));
  const ftsFile = path.join(dir, 'fts5.sqlite');
  const [fts, msFts] = time(() => buildFts5(entries, rows, ftsFile));
  const stamp = indexStamp(index, { count: 0, length: 0 });
  const [, msWrite] = time(() => writeSnapshot(dir, index, stamp));

  // start-up and resident memory, each side in a fresh process
  const child = (side: string) =>
    JSON.parse(execFileSync(process.execPath, ['--import', 'tsx', path.join(import.meta.dirname, 'search-cold-start.ts'), side, dir, stamp, ftsFile], { encoding: 'utf8', maxBuffer: 1 << 20 }).trim().split('\n').pop()!) as {
      msReady: number;
      msFirst: number;
      rssIndexMB: number;
      rssServedMB: number;
    };
  const app = child('app');
  const lite = child('fts5');

  // page times, interleaved
  const mix = queryMix();
  for (const q of queryMix(777)) {
    appPage(index, fts.rowsOf, q);
    fts.page(q);
  }
  const times = { app: mix.map(() => [] as number[]), fts: mix.map(() => [] as number[]) };
  for (let round = 0; round < ROUNDS; round++) {
    mix.forEach((q, i) => {
      const a = () => times.app[i].push(time(() => appPage(index, fts.rowsOf, q))[1]);
      const b = () => times.fts[i].push(time(() => fts.page(q))[1]);
      if (round % 2 === 0) {
        a();
        b();
      } else {
        b();
        a();
      }
    });
  }
  const appMs = times.app.map(median);
  const ftsMs = times.fts.map(median);

  // relevance on the judged set, as a moderator (every case visible to both)
  const judgedQueries = judgeQueries(index, fts, titleOf);
  const ndcgApp = meanOf(judgedQueries.map((j) => j.ndcgApp));
  const ndcgFts = meanOf(judgedQueries.map((j) => j.ndcgFts5));

  console.log('');
  console.log(`${count} cases (+${judgedCount} judged)     app              fts5`);
  console.log(`index time                 ${ms(msIndex).padEnd(16)} ${ms(msFts)}`);
  console.log(`start-up to ready          ${ms(app.msReady).padEnd(16)} ${ms(lite.msReady)}   (fresh process, from disk; app snapshot ${mb(statSync(snapshotPath(dir)).size / 1e6)}, written in ${ms(msWrite)}; fts5 file ${mb(statSync(ftsFile).size / 1e6)})`);
  console.log(`RSS for the index          ${mb(app.rssIndexMB).padEnd(16)} ${mb(lite.rssIndexMB)}   (resident memory added by loading, fresh process)`);
  console.log(`RSS after serving the mix  ${mb(app.rssServedMB).padEnd(16)} ${mb(lite.rssServedMB)}`);
  console.log(`first page after start     ${ms(app.msFirst).padEnd(16)} ${ms(lite.msFirst)}`);
  console.log(`full page p50              ${ms(quantile(appMs, 0.5)).padEnd(16)} ${ms(quantile(ftsMs, 0.5))}`);
  console.log(`full page p95              ${ms(quantile(appMs, 0.95)).padEnd(16)} ${ms(quantile(ftsMs, 0.95))}`);
  console.log(`nDCG@5, judged set         ${ndcgApp.toFixed(3).padEnd(16)} ${ndcgFts.toFixed(3)}   (${judgedQueries.length} queries; fts5: plain BM25)`);
  const kinds = [...new Set(mix.map((q) => q.kind))];
  console.log('by kind of query, page p50 / p95:');
  for (const k of kinds) {
    const at = mix.flatMap((q, i) => (q.kind === k ? [i] : []));
    const a = at.map((i) => appMs[i]);
    const f = at.map((i) => ftsMs[i]);
    console.log(`  ${k.padEnd(26)} app ${ms(quantile(a, 0.5))} / ${ms(quantile(a, 0.95)).padEnd(9)} fts5 ${ms(quantile(f, 0.5))} / ${ms(quantile(f, 0.95))}`);
  }
  ratios.push(`${count}: page p95 ratio (app/fts5) ${(quantile(appMs, 0.95) / quantile(ftsMs, 0.95)).toFixed(2)}, p50 ${(quantile(appMs, 0.5) / quantile(ftsMs, 0.5)).toFixed(2)}; RSS ${mb(app.rssIndexMB)} vs ${mb(lite.rssIndexMB)}; ready ${ms(app.msReady)}; nDCG@5 ${ndcgApp.toFixed(3)} vs ${ndcgFts.toFixed(3)}`);
  fts.close();
  rmSync(dir, { recursive: true, force: true });
}
console.log('');
for (const r of ratios) console.log(r);
