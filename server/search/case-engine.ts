import MiniSearch, { type Options } from 'minisearch';
import type { CaseDoc } from './case-document';

type DocFreqs = Map<number, number>;
type FieldTermData = Map<number, DocFreqs>;

/** Everything `toJSON()` writes except the postings, which go to a binary buffer. */
export interface EngineHeader {
  documentCount: number;
  nextId: number;
  documentIds: [number, number][];
  fieldIds: Record<string, number>;
  fieldLength: [number, number[]][];
  averageFieldLength: number[];
  dirtCount: number;
  terms: string[];
}

/**
 * minisearch with read access to its term dictionary and a compact snapshot.
 *
 * The dictionary (a radix tree of term → field → case → frequency) is a protected member that
 * minisearch exposes for extension; this subclass reads it so the query planner can see which
 * terms exist and how common they are, and writes it only when restoring a snapshot, filling
 * the same structures `loadJS` fills. The snapshot holds what `toJSON()` holds, with the
 * postings as typed arrays instead of JSON objects: restoring 10,000 cases then costs a few
 * hundred milliseconds instead of seconds of JSON parsing.
 */
export class CaseEngine extends MiniSearch<CaseDoc> {
  constructor(options: Options<CaseDoc>) {
    super(options);
  }

  hasTerm(term: string): boolean {
    return this._index.has(term);
  }

  /** Postings of a term summed over fields: its cost to score. */
  postings(term: string): number {
    let n = 0;
    for (const docs of this._index.get(term)?.values() ?? []) n += docs.size;
    return n;
  }

  /**
   * How many cases hold a term in any field; above `cap` postings the count is not needed
   * exactly, and the summed postings (≥ the count of cases... ≥ cap) are returned.
   */
  documentFrequency(term: string, cap: number): number {
    const data = this._index.get(term);
    if (!data) return 0;
    let sum = 0;
    for (const docs of data.values()) sum += docs.size;
    if (data.size === 1 || sum > data.size * cap) return sum;
    const ids = new Set<number>();
    for (const docs of data.values()) for (const id of docs.keys()) ids.add(id);
    return ids.size;
  }

  /** Terms that start with `prefix` (itself excluded), with their postings, at most `limit` of them. */
  completions(prefix: string, limit: number): { term: string; postings: number }[] {
    const out: { term: string; postings: number }[] = [];
    for (const [term, data] of this._index.atPrefix(prefix)) {
      if (term === prefix) continue;
      let n = 0;
      for (const docs of data.values()) n += docs.size;
      out.push({ term, postings: n });
    }
    // a short prefix can have hundreds of completions: keep the ones most cases use
    return out.length > limit ? out.sort((a, b) => b.postings - a.postings).slice(0, limit) : out;
  }

  /** Terms within `distance` edits of `term` (itself excluded). */
  nearTerms(term: string, distance: number): { term: string; distance: number }[] {
    const out: { term: string; distance: number }[] = [];
    for (const [t, [, d]] of this._index.fuzzyGet(term, distance)) if (d > 0) out.push({ term: t, distance: d });
    return out;
  }

  /** The index as a small JSON header and one buffer of postings. */
  encode(): { header: EngineHeader; postings: Buffer } {
    const terms: string[] = [];
    let words = 0;
    for (const [term, data] of this._index) {
      terms.push(term);
      words += 1;
      for (const docs of data.values()) words += 2 + 2 * docs.size;
    }
    const out = new Uint32Array(words);
    let at = 0;
    for (const [, data] of this._index) {
      out[at++] = data.size;
      for (const [fieldId, docs] of data) {
        out[at++] = fieldId;
        out[at++] = docs.size;
        for (const [doc, freq] of docs) {
          out[at++] = doc;
          out[at++] = freq;
        }
      }
    }
    return {
      header: {
        documentCount: this._documentCount,
        nextId: this._nextId,
        documentIds: [...this._documentIds],
        fieldIds: this._fieldIds,
        fieldLength: [...this._fieldLength],
        averageFieldLength: this._avgFieldLength,
        dirtCount: this._dirtCount,
        terms,
      },
      postings: Buffer.from(out.buffer, out.byteOffset, out.byteLength),
    };
  }

  /** Restores an `encode()`d index; `options` must be the ones it was built with. */
  static decode(header: EngineHeader, postings: Buffer, options: Options<CaseDoc>): CaseEngine {
    const engine = new CaseEngine(options);
    engine._documentCount = header.documentCount;
    engine._nextId = header.nextId;
    engine._documentIds = new Map(header.documentIds);
    engine._idToShortId = new Map(header.documentIds.map(([short, id]) => [id, short]));
    engine._fieldIds = header.fieldIds;
    engine._fieldLength = new Map(header.fieldLength);
    engine._avgFieldLength = header.averageFieldLength;
    engine._dirtCount = header.dirtCount;
    engine._storedFields = new Map();
    const words = new Uint32Array(postings.buffer, postings.byteOffset, postings.byteLength / 4);
    // a new engine starts with an empty dictionary: fill it as loadJS does
    const index = engine._index;
    let at = 0;
    for (const term of header.terms) {
      const data: FieldTermData = new Map();
      const fields = words[at++];
      for (let f = 0; f < fields; f++) {
        const fieldId = words[at++];
        const n = words[at++];
        const docs: DocFreqs = new Map();
        for (let k = 0; k < n; k++, at += 2) docs.set(words[at], words[at + 1]);
        data.set(fieldId, docs);
      }
      index.set(term, data);
    }
    return engine;
  }
}
