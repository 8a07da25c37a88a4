import Database from 'better-sqlite3';
import { STOPWORDS } from '../shared/search/stopwords';
import type { SearchSourceRow } from '../server/db/repositories/search-source';
import type { CaseDoc, CaseFacts } from '../server/search/case-document';
import type { BenchQuery } from './search-queries';

/**
 * The same corpus in SQLite FTS5 (porter stemmer over unicode61, the usual English setup),
 * queried the way an FTS5-backed search page would be: the words ANDed (OR when nothing
 * matches), the word being typed as a prefix, BM25 with the same field weights, the same
 * visibility rule; the page is the top 20 with highlighted title and summary and a narrative
 * snippet, the total, and facet counts by cause, status and tag over the visible matches.
 * The file also holds the cases' text, which both sides read the shown page from.
 */
export function buildFts5(entries: { doc: CaseDoc; facts: CaseFacts }[], rows: SearchSourceRow[], file = ':memory:') {
  const db = new Database(file);
  db.exec(`create virtual table fts using fts5(title, summary, meta, remedy, narrative, tokenize='porter unicode61');
           create table facts(id integer primary key, status text not null, author_id integer not null, cause text);
           create table tags(case_id integer not null, tag text not null);
           create table cases(id integer primary key, title text, summary text, narrative text, fix text, lesson_summary text, lesson_detail text, cause text);`);
  const insertDoc = db.prepare('insert into fts(rowid, title, summary, meta, remedy, narrative) values (?, ?, ?, ?, ?, ?)');
  const insertFacts = db.prepare('insert into facts(id, status, author_id, cause) values (?, ?, ?, ?)');
  const insertTag = db.prepare('insert into tags(case_id, tag) values (?, ?)');
  const insertCase = db.prepare('insert into cases(id, title, summary, narrative, fix, lesson_summary, lesson_detail, cause) values (?, ?, ?, ?, ?, ?, ?, ?)');
  db.transaction(() => {
    for (const { doc, facts } of entries) {
      insertDoc.run(doc.id, doc.title, doc.summary, doc.meta, doc.remedy, doc.narrative);
      insertFacts.run(doc.id, facts.status, facts.authorId, facts.cause);
      for (const t of facts.tags) insertTag.run(doc.id, t);
    }
    for (const r of rows) insertCase.run(r.id, r.title, r.summary, r.narrative, r.fix, r.lesson_summary, r.lesson_detail, r.cause);
  })();
  db.exec('create index tags_case on tags(case_id)');
  db.exec("insert into fts(fts) values('optimize')");
  return { db, ...queriesOn(db) };
}

export interface FtsPage {
  ids: number[];
  total: number;
}

/** The benchmark's queries against an FTS5 database built by `buildFts5` (in memory or reopened from a file). */
export function queriesOn(db: Database.Database) {
  const visible = "(facts.status = 'verified' or facts.author_id = @author)";
  const cond = { engineer: `fts match @q and ${visible}`, moderator: 'fts match @q' };
  const statements = Object.fromEntries(
    (['engineer', 'moderator'] as const).map((role) => [
      role,
      {
        top: db.prepare(
          `select fts.rowid as id, bm25(fts, 4, 3, 2.5, 1.5, 1) as score, highlight(fts, 0, '[', ']') as title, highlight(fts, 1, '[', ']') as summary,
             snippet(fts, 4, '[', ']', '…', 30) as narrative
           from fts join facts on facts.id = fts.rowid where ${cond[role]} order by score limit 20`,
        ),
        count: db.prepare(`select count(*) as n from fts join facts on facts.id = fts.rowid where ${cond[role]}`),
        cause: db.prepare(`select facts.cause as k, count(*) as n from fts join facts on facts.id = fts.rowid where ${cond[role]} group by facts.cause`),
        status: db.prepare(`select facts.status as k, count(*) as n from fts join facts on facts.id = fts.rowid where ${cond[role]} group by facts.status`),
        tags: db.prepare(`select tags.tag as k, count(*) as n from fts join facts on facts.id = fts.rowid join tags on tags.case_id = fts.rowid where ${cond[role]} group by tags.tag order by n desc limit 30`),
      },
    ]),
  ) as Record<'engineer' | 'moderator', Record<'top' | 'count' | 'cause' | 'status' | 'tags', Database.Statement>>;
  const rowsOf = db.prepare('select id, title, summary, narrative, fix, lesson_summary, lesson_detail, cause from cases where id in (select value from json_each(?))');

  function matchExpr(q: string, join: 'AND' | 'OR'): string | undefined {
    const words = q.toLowerCase().match(/[\p{L}\p{N}]+/gu)?.filter((w) => !STOPWORDS.has(w)) ?? [];
    if (words.length === 0) return undefined;
    const typing = /[\p{L}\p{N}]$/u.test(q);
    return words.map((w, i) => `"${w}"${typing && i === words.length - 1 ? '*' : ''}`).join(` ${join} `);
  }

  /** Plain BM25: the top 20 ids and the total. */
  function search(bq: BenchQuery): FtsPage {
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

  /** The whole page: top 20 with highlights and snippet, their rows, the total and the facets. */
  function page(bq: BenchQuery): FtsPage {
    const s = statements[bq.as.role];
    for (const join of ['AND', 'OR'] as const) {
      const expr = matchExpr(bq.q, join);
      if (!expr) return { ids: [], total: 0 };
      const params = { q: expr, author: bq.as.id };
      const total = (s.count.get(params) as { n: number }).n;
      if (total === 0 && join === 'AND') continue;
      const top = s.top.all(params) as { id: number }[];
      rowsOf.all(JSON.stringify(top.map((r) => r.id)));
      s.cause.all(params);
      s.status.all(params);
      s.tags.all(params);
      return { ids: top.map((r) => r.id), total };
    }
    return { ids: [], total: 0 };
  }
  return { search, page, rowsOf, close: () => db.close() };
}
