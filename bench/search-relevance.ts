/**
 * npm run bench:relevance — the relevance half of bench:search, without the timing parts:
 * builds the generated corpus with the judged cases mixed in, ranks each judged query with the
 * app's search and with plain FTS5 BM25, and prints nDCG@5 per query and on average.
 * BENCH_SIZES=10000 (default) or a list; `-- --verbose` prints the top 5 where the two differ.
 */
import { caseDocument } from '../server/search/case-document';
import { CaseIndex } from '../server/search/case-index';
import { rankCases } from '../server/search/rank';
import { generateCorpus } from './search-corpus';
import { buildFts5 } from './search-fts5';
import { JUDGED_QUERIES, judgedRows, ndcgAt } from './search-judged';

const SIZES = (process.env.BENCH_SIZES ?? '10000').split(',').map(Number);
const verbose = process.argv.includes('--verbose');
const as = { role: 'moderator' as const, id: 999 };

for (const count of SIZES) {
  const corpus = generateCorpus(count);
  const judged = judgedRows(count);
  const rows = [...corpus.rows, ...judged.rows];
  const tags = new Map([...corpus.tags, ...judged.tags]);
  const entries = rows.map((r) => caseDocument(r, tags.get(r.id) ?? [], new Map()));
  const titleOf = new Map(rows.map((r) => [r.id, r.title]));
  const index = new CaseIndex();
  index.addAll(entries);
  const fts = buildFts5(entries, rows);

  let app = 0;
  let bm25 = 0;
  console.log(`${count} cases (+${judged.rows.length} judged)                 app   fts5`);
  for (const j of JUDGED_QUERIES) {
    const mine = rankCases(index, as, { q: j.q, page: 1, pageSize: 5 }, new Map()).page.map((r) => titleOf.get(r.id)!);
    const theirs = fts.search({ q: j.q, as, kind: 'judged' }).ids.slice(0, 5).map((id) => titleOf.get(id)!);
    const a = ndcgAt(5, mine, j.relevant);
    const f = ndcgAt(5, theirs, j.relevant);
    app += a / JUDGED_QUERIES.length;
    bm25 += f / JUDGED_QUERIES.length;
    console.log(`  ${j.q.trim().padEnd(45)} ${a.toFixed(3)} ${f.toFixed(3)}${a === f ? '' : a > f ? '  app better' : '  fts5 better'}`);
    if (verbose && a !== f) {
      console.log(`    app:  ${mine.join(' | ')}`);
      console.log(`    fts5: ${theirs.join(' | ')}`);
    }
  }
  console.log(`nDCG@5 at ${count}: app ${app.toFixed(3)}, fts5 BM25 ${bm25.toFixed(3)} (${JUDGED_QUERIES.length} queries)`);
  fts.close();
}
