import Database from 'better-sqlite3';
import { STOPWORDS } from '../shared/search/stopwords';
import type { CaseDoc } from '../server/search/case-document';
import type { CaseFacts } from '../server/search/case-document';
import type { BenchQuery } from './search-queries';

/**
 * The same corpus in SQLite FTS5 (porter stemmer over unicode61, the usual English setup),
 * queried the way an FTS5-backed search would be: the words ANDed (OR when nothing matches),
 * the word being typed as a prefix, BM25 with the same field weights, the same visibility rule,
 * the top 20 and the total.
 */
export function buildFts5(entries: { doc: CaseDoc; facts: CaseFacts }[], file = ':memory:') {
  const db = new Database(file);
  db.exec(`create virtual table fts using fts5(title, summary, meta, remedy, narrative, tokenize='porter unicode61');
           create table facts(id integer primary key, status text not null, author_id integer not null, cause text);`);
  const insertDoc = db.prepare('insert into fts(rowid, title, summary, meta, remedy, narrative) values (?, ?, ?, ?, ?, ?)');
  const insertFacts = db.prepare('insert into facts(id, status, author_id, cause) values (?, ?, ?, ?)');
  db.transaction(() => {
    for (const { doc, facts } of entries) {
      insertDoc.run(doc.id, doc.title, doc.summary, doc.meta, doc.remedy, doc.narrative);
      insertFacts.run(doc.id, facts.status, facts.authorId, facts.cause);
    }
  })();
  db.exec("insert into fts(fts) values('optimize')");
  return { db, ...queriesOn(db) };
}

/** The benchmark's queries against an FTS5 database built by `buildFts5` (in memory or reopened from a file). */
export function queriesOn(db: Database.Database) {
  const visible = "(facts.status = 'verified' or facts.author_id = @author)";
  const statements = {
    engineer: {
      top: db.prepare(`select fts.rowid as id, bm25(fts, 4, 3, 2.5, 1.5, 1) as score from fts join facts on facts.id = fts.rowid where fts match @q and ${visible} order by score limit 20`),
      count: db.prepare(`select count(*) as n from fts join facts on facts.id = fts.rowid where fts match @q and ${visible}`),
    },
    moderator: {
      top: db.prepare('select rowid as id, bm25(fts, 4, 3, 2.5, 1.5, 1) as score from fts where fts match @q order by score limit 20'),
      count: db.prepare('select count(*) as n from fts where fts match @q'),
    },
  };

  function matchExpr(q: string, join: 'AND' | 'OR'): string | undefined {
    const words = q.toLowerCase().match(/[\p{L}\p{N}]+/gu)?.filter((w) => !STOPWORDS.has(w)) ?? [];
    if (words.length === 0) return undefined;
    const typing = /[\p{L}\p{N}]$/u.test(q);
    return words.map((w, i) => `"${w}"${typing && i === words.length - 1 ? '*' : ''}`).join(` ${join} `);
  }

  function search(bq: BenchQuery): { ids: number[]; total: number } {
    const s = statements[bq.as.role];
    for (const join of ['AND', 'OR'] as const) {
      const expr = matchExpr(bq.q, join);
      if (!expr) return { ids: [], total: 0 };
      const params = { q: expr, author: bq.as.id };
      const total = (s.count.get(params) as { n: number }).n;
      if (total > 0 || join === 'OR') return { ids: (s.top.all(params) as { id: number }[]).map((r) => r.id), total };
    }
    return { ids: [], total: 0 };
  }
  return { search, close: () => db.close() };
}
