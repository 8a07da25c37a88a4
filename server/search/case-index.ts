import type { CaseFacts, CaseDoc } from './case-document';
import { CompactEngine } from './compact-engine';
import { FacetRows } from './facet-rows';

/** An index term a query word stands for, with the weight its kind of match carries. */
export interface WeightedTerm {
  term: string;
  weight: number;
}

/** One query word as the index terms that count as it (itself, its completions, its near spellings). */
export interface TermGroup {
  word: string;
  terms: WeightedTerm[];
  /** A word still being typed: its terms are alternatives, scored as one word (`CompactEngine.scoreAnyOfSlots`). */
  typing?: boolean;
}

/**
 * Kept for callers that pass tuning; the compact index needs none. (Common-term scores used to
 * be precomputed above a fixed 1,000 postings, 19.4M scores at 100k cases; scoring a typed
 * array of postings is now cheap enough that nothing is precomputed.)
 */
export type IndexTuning = Record<string, never>;

/** The cases' compact inverted index and the facts that filter and facet them. */
export class CaseIndex {
  readonly facts = new Map<number, CaseFacts>();
  /** Per case, its cause, status and tags as small numbers (`facetName` reads them back), so facets count into arrays; kept with `facts`. */
  readonly facetRows = new FacetRows();
  private readonly codeOf = new Map<string, number>();
  private readonly names: string[] = [];
  /** Cases by stated and by engine cause: symptom fitting reads only the inferred causes' cases. */
  private readonly byCause = new Map<string, Set<number>>();

  constructor(public engine = new CompactEngine()) {}

  get size() {
    return this.facts.size;
  }

  addAll(entries: { doc: CaseDoc; facts: CaseFacts }[]) {
    this.engine.addAll(entries.map((e) => e.doc));
    for (const e of entries) this.setFacts(e.doc.id, e.facts);
  }

  upsert(doc: CaseDoc, facts: CaseFacts) {
    this.engine.add(doc);
    this.setFacts(doc.id, facts);
  }

  remove(id: number) {
    this.engine.discard(id);
    this.deleteFacts(id);
  }

  /** Records what filters and facets a case, keeping the per-cause lists in step. */
  setFacts(id: number, facts: CaseFacts) {
    this.deleteFacts(id);
    this.facts.set(id, facts);
    this.facetRows.set(id, {
      cause: facts.cause ? this.code(facts.cause) : -1,
      status: this.code(facts.status),
      engineCause: facts.engineCause ? this.code(facts.engineCause) : -1,
      authorId: facts.authorId,
      tags: facts.tags.map((t) => this.code(t)),
    });
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
    this.facetRows.delete(id);
    if (old.cause) this.byCause.get(old.cause)?.delete(id);
    if (old.engineCause) this.byCause.get(old.engineCause)?.delete(id);
  }

  /** The code of a facet value (a cause, status or tag), given out on first sight; codes are never reused. */
  code(name: string): number {
    let code = this.codeOf.get(name);
    if (code === undefined) {
      code = this.names.length;
      this.names.push(name);
      this.codeOf.set(name, code);
    }
    return code;
  }

  /** The code of a facet value already seen, else −1. */
  knownCode(name: string): number {
    return this.codeOf.get(name) ?? -1;
  }

  facetName(code: number): string {
    return this.names[code];
  }

  /** How many facet values have codes: the size of a count array. */
  get codeCount(): number {
    return this.names.length;
  }

  /** Cases filed under `cause` or diagnosed as it by the engine. */
  casesOfCause(cause: string): Iterable<number> {
    return this.byCause.get(cause) ?? [];
  }

  /** What scoring a group costs: the postings to walk. */
  groupCost(group: TermGroup): number {
    return group.terms.reduce((sum, t) => sum + this.engine.postings(t.term), 0);
  }

  /** `scoreGroup` by slot (see `CompactEngine.scoreTermSlots`). */
  scoreGroupSlots(group: TermGroup, admit: (slot: number) => boolean, acc: Float64Array, touched: number[]) {
    if (group.typing) this.engine.scoreAnyOfSlots(group.terms, admit, acc, touched);
    else for (const t of group.terms) this.engine.scoreTermSlots(t.term, t.weight, admit, acc, touched);
  }

  /** Σ weight × BM25F over a group's terms (a word being typed: the best of them, see `scoreAnyOfSlots`), for the cases `allow` admits. */
  scoreGroup(group: TermGroup, allow: (id: number) => boolean): Map<number, number> {
    const out = new Map<number, number>();
    if (group.typing) this.engine.scoreAnyOf(group.terms, allow, out);
    else for (const t of group.terms) this.engine.scoreTerm(t.term, t.weight, allow, out);
    return out;
  }
}
