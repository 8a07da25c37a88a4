import type MiniSearch from 'minisearch';
import type { CaseDoc } from './case-document';

/** One term's minisearch scores over every case that has it, ordered by case id. */
export interface ScoreList {
  ids: Int32Array;
  scores: Float32Array;
}

export interface SerializedHeavyTerms {
  docCount: number;
  /** [term, ids (base64 Int32), scores (base64 Float32)] */
  lists: [string, string, string][];
}

const toBase64 = (a: Int32Array | Float32Array) => Buffer.from(a.buffer, a.byteOffset, a.byteLength).toString('base64');
const int32Of = (b64: string) => {
  const buf = Buffer.from(b64, 'base64');
  return new Int32Array(buf.buffer.slice(buf.byteOffset, buf.byteOffset + buf.byteLength));
};
const float32Of = (b64: string) => {
  const buf = Buffer.from(b64, 'base64');
  return new Float32Array(buf.buffer.slice(buf.byteOffset, buf.byteOffset + buf.byteLength));
};

/** Position of `id` in a sorted list, or where it would go (as −(insertion point) − 1). */
function find(ids: Int32Array, id: number): number {
  let lo = 0;
  let hi = ids.length - 1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    if (ids[mid] < id) lo = mid + 1;
    else if (ids[mid] > id) hi = mid - 1;
    else return mid;
  }
  return -lo - 1;
}

/**
 * Scored results of the most common terms, kept ready.
 *
 * A common word ("probe", "edge") is in thousands of cases, and scoring it is most of what a
 * query costs; such words are also the ones queries repeat. So minisearch scores each of them
 * once, here, and queries read the list (typed arrays: a few MB, nothing for the collector to
 * walk). Writes keep the lists exact in membership: a changed case leaves every list and is
 * scored again for the common terms it now has. Scores of other cases drift by the change in
 * document count, which `drifted` reports so the owner can rebuild the lists.
 */
export class HeavyTerms {
  lists = new Map<string, ScoreList>();
  docCount = 0;
  changes = 0;

  /** Scores `terms` from scratch. */
  build(engine: MiniSearch<CaseDoc>, terms: Iterable<string>) {
    const lists = new Map<string, ScoreList>();
    for (const term of terms) lists.set(term, scoreAll(engine, term));
    this.lists = lists;
    this.docCount = engine.documentCount;
    this.changes = 0;
  }

  get(term: string): ScoreList | undefined {
    return this.lists.get(term);
  }

  has(term: string) {
    return this.lists.has(term);
  }

  /** Takes a case out of every list (it was deleted, or is about to be re-scored). */
  removeDoc(id: number) {
    for (const [term, list] of this.lists) {
      const at = find(list.ids, id);
      if (at < 0) continue;
      const ids = new Int32Array(list.ids.length - 1);
      const scores = new Float32Array(list.ids.length - 1);
      ids.set(list.ids.subarray(0, at));
      ids.set(list.ids.subarray(at + 1), at);
      scores.set(list.scores.subarray(0, at));
      scores.set(list.scores.subarray(at + 1), at);
      this.lists.set(term, { ids, scores });
    }
    this.changes++;
  }

  /** Scores a case that was added or changed for the listed terms it has. */
  addDoc(engine: MiniSearch<CaseDoc>, id: number, docTerms: Set<string>) {
    for (const [term, list] of this.lists) {
      if (!docTerms.has(term)) continue;
      const hit = engine.search(term, { boostDocument: (docId: number) => (docId === id ? 1 : 0) })[0];
      if (!hit) continue;
      const at = -find(list.ids, id) - 1;
      if (at < 0) continue;
      const ids = new Int32Array(list.ids.length + 1);
      const scores = new Float32Array(list.ids.length + 1);
      ids.set(list.ids.subarray(0, at));
      ids[at] = id;
      ids.set(list.ids.subarray(at), at + 1);
      scores.set(list.scores.subarray(0, at));
      scores[at] = hit.score;
      scores.set(list.scores.subarray(at), at + 1);
      this.lists.set(term, { ids, scores });
    }
  }

  /** True once enough cases changed that the stored scores should be recomputed. */
  drifted(documentCount: number): boolean {
    return this.changes > Math.max(50, 0.02 * documentCount) || Math.abs(documentCount - this.docCount) > Math.max(50, 0.02 * this.docCount);
  }

  /** Postings held, for the benchmark's account of memory. */
  get entries() {
    let n = 0;
    for (const l of this.lists.values()) n += l.ids.length;
    return n;
  }

  toJSON(): SerializedHeavyTerms {
    return { docCount: this.docCount, lists: [...this.lists].map(([t, l]) => [t, toBase64(l.ids), toBase64(l.scores)]) };
  }

  static fromJSON(s: SerializedHeavyTerms): HeavyTerms {
    const h = new HeavyTerms();
    h.docCount = s.docCount;
    for (const [t, ids, scores] of s.lists) h.lists.set(t, { ids: int32Of(ids), scores: float32Of(scores) });
    return h;
  }
}

/** minisearch's score for one term over all cases, as a list sorted by case id. */
function scoreAll(engine: MiniSearch<CaseDoc>, term: string): ScoreList {
  const results = engine.search(term);
  results.sort((a, b) => (a.id as number) - (b.id as number));
  const ids = new Int32Array(results.length);
  const scores = new Float32Array(results.length);
  results.forEach((r, i) => {
    ids[i] = r.id as number;
    scores[i] = r.score;
  });
  return { ids, scores };
}
