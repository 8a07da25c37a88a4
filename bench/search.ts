/**
 * npm run bench:search — minisearch (the product's index) against SQLite FTS5 over the same
 * 10,000 generated cases, in the same run: index time, memory, cold start from what is on
 * disk, and query p50/p95 over a fixed mix of 200 queries. Ends with the p95 ratio line.
 *
 * Queries run interleaved (one engine then the other, the order swapped every round) for
 * three rounds after a warm-up on a different mix; each query's time is its median over the
 * rounds, which keeps other work on a shared machine from landing on one engine only. Both
 * sides do the same job: every visible match found, the top 20 by BM25 and the total.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import v8 from 'node:v8';
import vm from 'node:vm';
import { canModerate } from '../shared/auth/roles';
import { caseDocument } from '../server/search/case-document';
import { CaseIndex } from '../server/search/case-index';
import { highlightsFor } from '../server/search/highlight';
import { planQuery } from '../server/search/query-plan';
import { rankCases } from '../server/search/rank';
import { runTextQuery } from '../server/search/run-query';
import { indexStamp, snapshotPath, writeSnapshot } from '../server/search/snapshot';
import { topK } from '../server/search/top-k';
import { generateCorpus } from './search-corpus';
import { buildBaseline } from './search-baseline';
import { buildFts5 } from './search-fts5';
import { queryMix, type BenchQuery } from './search-queries';

v8.setFlagsFromString('--expose-gc');
const gc = vm.runInNewContext('gc') as () => void;
const mb = (bytes: number) => `${(bytes / 1e6).toFixed(0)} MB`;
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
const memory = () => {
  gc();
  gc();
  return process.memoryUsage();
};

const COUNT = Number(process.env.BENCH_CASES ?? 10_000);
/** BENCH_BASELINE=1 also times minisearch out of the box (adds about a minute). */
const BASELINE = process.env.BENCH_BASELINE === '1';
const ROUNDS = 3;
console.log(`search benchmark: ${COUNT} generated cases, 200 queries × ${ROUNDS} rounds, node ${process.version}`);

const { rows, tags } = generateCorpus(COUNT);
const entries = rows.map((r) => caseDocument(r, tags.get(r.id) ?? [], new Map()));
const words = rows.reduce((n, r) => n + `${r.title} ${r.summary} ${r.narrative} ${r.fix} ${r.lesson_summary}`.split(/\s+/).length, 0);
console.log(`corpus: ${(words / rows.length).toFixed(0)} words per case on average`);

// ---- index time
const index = new CaseIndex();
const [, msIndex] = time(() => index.engine.addAll(entries.map((e) => e.doc)));
for (const e of entries) index.setFacts(e.doc.id, e.facts);
const [, msHeavy] = time(() => index.rebuildHeavy());

const dir = mkdtempSync(path.join(tmpdir(), 'falsetrace-bench-search-'));
const ftsFile = path.join(dir, 'fts5.sqlite');
const [fts, msFts] = time(() => buildFts5(entries, ftsFile));

// ---- cold start: a fresh process restores each index from disk
const stamp = indexStamp(index, { count: 0, length: 0 });
const [, msWrite] = time(() => writeSnapshot(dir, index, stamp));
const cold = JSON.parse(execFileSync(process.execPath, ['--import', 'tsx', path.join(import.meta.dirname, 'search-cold-start.ts'), dir, stamp, ftsFile], { encoding: 'utf8' }).trim().split('\n').pop()!);

// ---- queries
const visibleFor = (q: BenchQuery) => {
  if (canModerate({ role: q.as.role })) return () => true;
  return (id: number) => {
    const f = index.facts.get(id)!;
    return f.status === 'verified' || f.authorId === q.as.id;
  };
};
const synonyms = new Map<string, string>();
/** What the FTS5 side does too: all visible matches, the top 20 by score, the total. */
function minisearchCore(q: BenchQuery) {
  const result = runTextQuery(index, planQuery(q.q, index, synonyms), visibleFor(q));
  return { ids: topK(result.scores, 20, (a, b) => b[1] - a[1]).map(([id]) => id), total: result.scores.size };
}
/** The whole search page the API serves: symptom reading, blending, facets and highlights. */
function minisearchPage(q: BenchQuery) {
  const r = rankCases(index, { id: q.as.id, role: q.as.role }, { q: q.q, page: 1, pageSize: 20 }, synonyms);
  for (const { id } of r.page) {
    const d = entries[id - 1].doc;
    highlightsFor([{ field: 'title', text: d.title }, { field: 'summary', text: d.summary }, { field: 'narrative', text: d.narrative }], r.terms);
  }
  return r.total;
}

for (const q of queryMix(777)) {
  minisearchCore(q);
  minisearchPage(q);
  fts.search(q);
}
const mix = queryMix();
const times = { core: mix.map(() => [] as number[]), page: mix.map(() => [] as number[]), fts: mix.map(() => [] as number[]) };
let agree = 0;
for (let round = 0; round < ROUNDS; round++) {
  mix.forEach((q, i) => {
    const runMs = () => time(() => minisearchCore(q));
    const runFts = () => time(() => fts.search(q));
    let mini: ReturnType<typeof runMs>;
    let lite: ReturnType<typeof runFts>;
    if (round % 2 === 0) {
      mini = runMs();
      lite = runFts();
    } else {
      lite = runFts();
      mini = runMs();
    }
    const [[a, ta], [b, tb]] = [mini, lite];
    times.core[i].push(ta);
    times.fts[i].push(tb);
    times.page[i].push(time(() => minisearchPage(q))[1]);
    if (round === 0 && a.total > 0 === b.total > 0) agree++;
  });
}
const core = times.core.map(median);
const heapWhole = memory().heapUsed;

// the out-of-the-box reference runs afterwards, so its second index does not weigh on the figures above
let baseline: { p50: number; p95: number; ftsP95: number; buildMs: number } | undefined;
if (BASELINE) {
  const [base, buildMs] = time(() => buildBaseline(entries));
  const b = mix.map(() => [] as number[]);
  const f = mix.map(() => [] as number[]);
  for (let round = 0; round < ROUNDS; round++) {
    mix.forEach((q, i) => {
      b[i].push(time(() => base.search(q))[1]);
      f[i].push(time(() => fts.search(q))[1]);
    });
  }
  const bm = b.map(median);
  baseline = { p50: quantile(bm, 0.5), p95: quantile(bm, 0.95), ftsP95: quantile(f.map(median), 0.95), buildMs };
}
const page = times.page.map(median);
const ftsTimes = times.fts.map(median);

const kinds = [...new Set(mix.map((q) => q.kind))];
console.log('');
console.log('                       minisearch       fts5');
console.log(`index time             ${ms(msIndex + msHeavy).padEnd(16)} ${ms(msFts)}   (minisearch: ${ms(msIndex)} index + ${ms(msHeavy)} common-term scores)`);
console.log(`memory, index alone    ${mb((cold.heapMB + cold.arrayBuffersMB) * 1e6).padEnd(16)} ${mb(statSync(ftsFile).size).padEnd(6)}   (minisearch: heap of a fresh process after the restore ${mb(cold.heapMB * 1e6)} + kept scores ${mb(cold.arrayBuffersMB * 1e6)}; fts5: the file, paged in on demand)`);
console.log(`heap, whole bench      ${mb(heapWhole)}           (corpus, both indexes' inputs and the minisearch index)`);
console.log(`cold start             ${ms(cold.msLoad).padEnd(16)} ${ms(cold.ftsOpen)}   (from disk to ready; snapshot ${mb(statSync(snapshotPath(dir)).size)}, written in ${ms(msWrite)})`);
console.log(`first query after      ${ms(cold.msFirst).padEnd(16)} ${ms(cold.ftsFirst)}`);
console.log(`query p50              ${ms(quantile(core, 0.5)).padEnd(16)} ${ms(quantile(ftsTimes, 0.5))}`);
console.log(`query p95              ${ms(quantile(core, 0.95)).padEnd(16)} ${ms(quantile(ftsTimes, 0.95))}`);
console.log(`full page p50 / p95    ${ms(quantile(page, 0.5))} / ${ms(quantile(page, 0.95))}   (minisearch with reading, facets, highlights; no fts5 counterpart)`);
if (baseline) {
  console.log(`out of the box p50/p95 ${ms(baseline.p50)} / ${ms(baseline.p95)}   (minisearch defaults, built in ${ms(baseline.buildMs)}, timed after the rest; p95 ratio to fts5 ${(baseline.p95 / baseline.ftsP95).toFixed(2)})`);
}
console.log(`common terms kept      ${index.heavy.lists.size} terms, ${index.heavy.entries} scores`);
console.log(`both found something   ${agree} of ${mix.length} queries agree on whether anything matches`);
console.log('');
console.log('by kind of query (p50 / p95):');
for (const k of kinds) {
  const at = mix.flatMap((q, i) => (q.kind === k ? [i] : []));
  const m = at.map((i) => core[i]);
  const f = at.map((i) => ftsTimes[i]);
  console.log(`  ${k.padEnd(26)} minisearch ${ms(quantile(m, 0.5))} / ${ms(quantile(m, 0.95)).padEnd(9)} fts5 ${ms(quantile(f, 0.5))} / ${ms(quantile(f, 0.95))}`);
}
fts.close();
rmSync(dir, { recursive: true, force: true });
console.log('');
console.log(`search p95 ratio (minisearch/fts5): ${(quantile(core, 0.95) / quantile(ftsTimes, 0.95)).toFixed(2)}`);
