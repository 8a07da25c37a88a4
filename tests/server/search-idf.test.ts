import Database from 'better-sqlite3';
import { describe, expect, it } from 'vitest';
import { inverseDocumentFrequency } from '../../server/search/bm25f';

/**
 * The idf the index scores with, against SQLite FTS5's own bm25() (a reference implementation, from
 * the registry's better-sqlite3): over one column, bm25() is −idf · tf (k1 + 1) / (tf + k1 (1 − b + b·len/avglen))
 * with k1 = 1.2, b = 0.75 and FTS5's idf. Taking that formula's tf part out of FTS5's score leaves its
 * idf, which must equal ours, including for words in half the documents or more (floored there).
 * source: SQLite FTS5 documentation, "The bm25() function"; Robertson & Zaragoza, FnTIR 3(4), 2009, 3.3.
 */
describe('inverse document frequency', () => {
  const docs = [
    'probe ringing buck converter',
    'probe ringing clip lead',
    'probe ringing ground spring',
    'probe tenth reading',
    'probe calibrator square',
    'ringing after every edge',
    'solenoid flyback spike',
  ];
  const db = new Database(':memory:');
  db.exec('create virtual table t using fts5(body)');
  const insert = db.prepare('insert into t(rowid, body) values (?, ?)');
  docs.forEach((d, i) => insert.run(i + 1, d));
  const avgLength = docs.reduce((s, d) => s + d.split(' ').length, 0) / docs.length;

  const fts5Idf = (word: string) => {
    const rows = db.prepare('select rowid as id, bm25(t) as score from t where t match ?').all(word) as { id: number; score: number }[];
    // every word here occurs once in its document
    return rows.map((r) => {
      const length = docs[r.id - 1].split(' ').length;
      const tfPart = (1 * 2.2) / (1 + 1.2 * (0.25 + (0.75 * length) / avgLength));
      return -r.score / tfPart;
    });
  };

  it.each([
    ['solenoid', 1], // in 1 of 7 documents
    ['buck', 1],
    ['clip', 1],
    ['ringing', 4], // in more than half: FTS5 floors it
    ['probe', 5],
  ])('should equal FTS5 bm25()’s idf for "%s" (in %i of 7)', (word, count) => {
    const theirs = fts5Idf(word);
    expect(theirs).toHaveLength(count);
    for (const idf of theirs) expect(inverseDocumentFrequency(docs.length, count) / idf).toBeCloseTo(1, 9);
  });

  it('should give a word in over half the cases next to nothing, and a rare word its full weight', () => {
    // source: the RSJ weight ln((N − n + 0.5) / (n + 0.5)) is negative above n = N/2 (Robertson & Zaragoza 2009, 3.3)
    expect(inverseDocumentFrequency(100_000, 66_610)).toBe(1e-6);
    expect(inverseDocumentFrequency(100_000, 42_895)).toBeCloseTo(Math.log(57_105.5 / 42_895.5), 12);
    expect(inverseDocumentFrequency(100_000, 10)).toBeCloseTo(Math.log(99_990.5 / 10.5), 12);
  });
});
