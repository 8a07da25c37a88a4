import type { Options } from 'minisearch';
import { indexTerms } from '../../shared/search/text-terms';
import { DOC_FIELDS, FIELD_BOOST, type CaseDoc, type CaseFacts } from './case-document';
import { CaseEngine } from './case-engine';
import { HeavyTerms } from './heavy-terms';

/** An index term a query word stands for, with the weight its kind of match carries. */
export interface WeightedTerm {
  term: string;
  weight: number;
}

/** One query word as the index terms that count as it (itself, its completions, its near spellings). */
export interface TermGroup {
  word: string;
  terms: WeightedTerm[];
}

const single = (text: string) => [text];
const identity = (term: string) => term;

/** Options shared by building, searching and restoring; they must not drift apart. */
export const INDEX_OPTIONS: Options<CaseDoc> = {
  fields: [...DOC_FIELDS],
  storeFields: [],
  tokenize: indexTerms,
  processTerm: identity,
  searchOptions: { boost: FIELD_BOOST, tokenize: single, processTerm: identity },
  // vacuuming the whole index in one go would stall requests: small batches, often enough
  autoVacuum: { batchSize: 2000, batchWait: 5, minDirtCount: 50, minDirtFactor: 0.05 },
};

export interface IndexTuning {
  /** A term with at least this many postings may have its scores kept ready (see HeavyTerms). */
  heavyPostings: number;
  /**
   * At most this many scores kept over all kept terms, the most common terms first. A fixed
   * threshold alone kept 19.4M scores at 100k cases (every term above it grows with the
   * casebook); a budget keeps the memory flat and spends it where scoring costs most.
   */
  heavyBudget?: number;
}
/** 2M scores: 16 MB of typed arrays. */
export const DEFAULT_TUNING: IndexTuning = { heavyPostings: 1000, heavyBudget: 2_000_000 };

const docTerms = (doc: CaseDoc) => new Set(DOC_FIELDS.flatMap((f) => indexTerms(doc[f])));

/** The cases' minisearch index, the facts that filter and facet them, and the common terms' scores. */
export class CaseIndex {
  readonly facts = new Map<number, CaseFacts>();
  /** Cases by stated and by engine cause: symptom fitting reads only the inferred causes' cases. */
  private readonly byCause = new Map<string, Set<number>>();

  constructor(
    public engine = new CaseEngine(INDEX_OPTIONS),
    public heavy = new HeavyTerms(),
    readonly tuning: IndexTuning = DEFAULT_TUNING,
  ) {}

  get size() {
    return this.facts.size;
  }

  addAll(entries: { doc: CaseDoc; facts: CaseFacts }[]) {
    this.engine.addAll(entries.map((e) => e.doc));
    for (const e of entries) this.setFacts(e.doc.id, e.facts);
    this.rebuildHeavy();
  }

  upsert(doc: CaseDoc, facts: CaseFacts) {
    this.heavy.removeDoc(doc.id);
    if (this.engine.has(doc.id)) this.engine.replace(doc);
    else this.engine.add(doc);
    this.heavy.addDoc(this.engine, doc.id, docTerms(doc));
    this.setFacts(doc.id, facts);
  }

  remove(id: number) {
    this.heavy.removeDoc(id);
    if (this.engine.has(id)) this.engine.discard(id);
    this.deleteFacts(id);
  }

  /** Records what filters and facets a case, keeping the per-cause lists in step. */
  setFacts(id: number, facts: CaseFacts) {
    this.deleteFacts(id);
    this.facts.set(id, facts);
    for (const c of new Set([facts.cause, facts.engineCause])) {
      if (!c) continue;
      let set = this.byCause.get(c);
      if (!set) this.byCause.set(c, (set = new Set()));
      set.add(id);
    }
  }

  private deleteFacts(id: number) {
    const old = this.facts.get(id);
    if (!old) return;
    this.facts.delete(id);
    if (old.cause) this.byCause.get(old.cause)?.delete(id);
    if (old.engineCause) this.byCause.get(old.engineCause)?.delete(id);
  }

  /** Cases filed under `cause` or diagnosed as it by the engine. */
  casesOfCause(cause: string): Iterable<number> {
    return this.byCause.get(cause) ?? [];
  }

  /** Which terms are common enough to keep scored: decided again whenever the lists are rebuilt. */
  heavyCandidates(): string[] {
    const common: { term: string; postings: number }[] = [];
    for (const c of this.engine.completions('', Infinity)) if (c.postings >= this.tuning.heavyPostings) common.push(c);
    common.sort((a, b) => b.postings - a.postings);
    const out: string[] = [];
    let left = this.tuning.heavyBudget ?? Infinity;
    for (const c of common) {
      // postings count a case once per field; the kept list holds it once, so this errs on the safe side
      if (c.postings > left) continue;
      left -= c.postings;
      out.push(c.term);
    }
    return out;
  }

  rebuildHeavy() {
    this.heavy.build(this.engine, this.heavyCandidates());
  }

  /** What scoring a group costs: postings for minisearch to walk; a kept list is read, not scored. */
  groupCost(group: TermGroup): number {
    return group.terms.reduce((sum, t) => sum + (this.heavy.has(t.term) ? (this.heavy.get(t.term)!.ids.length >> 4) : this.engine.postings(t.term)), 0);
  }

  /**
   * Σ weight × minisearch score over a group's terms, for the cases `allow` admits. Kept
   * lists are read; the rest go to minisearch in one query, the filter applied inside
   * scoring (a document boost of 0 skips the posting), so a narrow candidate set is cheap.
   */
  scoreGroup(group: TermGroup, allow: (id: number) => boolean): Map<number, number> {
    const out = new Map<number, number>();
    const rest: WeightedTerm[] = [];
    for (const t of group.terms) {
      const list = this.heavy.get(t.term);
      if (!list) {
        rest.push(t);
        continue;
      }
      const { ids, scores } = list;
      for (let i = 0; i < ids.length; i++) {
        const id = ids[i];
        if (allow(id)) out.set(id, (out.get(id) ?? 0) + t.weight * scores[i]);
      }
    }
    if (rest.length > 0) {
      const weights = new Map(rest.map((t) => [t.term, t.weight]));
      const results = this.engine.search(
        { combineWith: 'OR', queries: rest.map((t) => t.term) },
        { boostTerm: (term: string) => weights.get(term) ?? 1, boostDocument: (id: number) => (allow(id) ? 1 : 0) },
      );
      // minisearch multiplies by the number of query terms matched; a group is one word, so undo it
      for (const r of results) out.set(r.id as number, (out.get(r.id as number) ?? 0) + r.score / r.queryTerms.length);
    }
    return out;
  }
}
