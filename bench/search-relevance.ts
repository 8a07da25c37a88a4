/**
 * npm run bench:relevance — the relevance half of bench:search, without the timing parts:
 * builds the generated corpus with the judged cases mixed in, ranks each judged query with the
 * app's search and with plain FTS5 BM25, and prints nDCG@5 per query and on average.
 * BENCH_SIZES=10000 (default) or a list; `-- --verbose` prints the top 5 where the two differ.
 */
import { CaseIndex } from '../server/search/case-index';
import { buildFts5 } from './search-fts5';
import { judgedCorpus, judgeQueries, meanOf } from './search-judged-run';

const SIZES = (process.env.BENCH_SIZES ?? '10000').split(',').map(Number);
const verbose = process.argv.includes('--verbose');

for (const count of SIZES) {
  const { judgedCount, rows, entries, titleOf } = judgedCorpus(count);
  const index = new CaseIndex();
  index.addAll(entries);
  const fts = buildFts5(entries, rows);

  console.log(`${count} cases (+${judgedCount} judged)                 app   fts5`);
  const judged = judgeQueries(index, fts, titleOf);
  for (const { q, app: mine, fts5: theirs, ndcgApp: a, ndcgFts5: f } of judged) {
    console.log(`  ${q.trim().padEnd(45)} ${a.toFixed(3)} ${f.toFixed(3)}${a === f ? '' : a > f ? '  app better' : '  fts5 better'}`);
    if (verbose && a !== f) {
      console.log(`    app:  ${mine.join(' | ')}`);
      console.log(`    fts5: ${theirs.join(' | ')}`);
    }
  }
  const app = meanOf(judged.map((j) => j.ndcgApp));
  const bm25 = meanOf(judged.map((j) => j.ndcgFts5));
  console.log(`nDCG@5 at ${count}: app ${app.toFixed(3)}, fts5 BM25 ${bm25.toFixed(3)} (${judged.length} queries)`);
  fts.close();
}
