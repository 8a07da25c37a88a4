import { canSeeCase } from '../../shared/auth/case-policy';
import { canModerate, type Actor } from '../../shared/auth/roles';
import { symptomNumbersFit } from '../../shared/search/case-numbers';
import { isWrittenFormTerm } from '../../shared/search/stem';
import { readSymptomQuery, type SymptomReading } from '../../shared/search/symptom-query';
import type { SearchQuery } from '../../shared/schemas/search';
import type { CaseFacts } from './case-document';
import type { CaseIndex, TermGroup } from './case-index';
import { countFacets, type Facets } from './facets';
import { planQuery } from './query-plan';
import { runTextQuery } from './run-query';
import { topK } from './top-k';

export interface Ranked {
  id: number;
  score: number;
}

export interface RankedPage {
  page: Ranked[];
  total: number;
  facets: Facets;
  reading: SymptomReading | null;
  /** Index terms the query stood for, to mark in highlights. */
  terms: Set<string>;
}

/** A case whose engine diagnosis (not its stated cause) names the inferred cause counts this much. */
const ENGINE_CAUSE_MATCH = 0.6;
/** With a symptom reading, how much the cause and numbers weigh against the words. */
const SYMPTOM_WEIGHT = 0.6;
/**
 * A typed word found in at most this share of the cases (and at least `RARE_MIN` of them) is
 * rare: whoever types "piezo" means the case about the piezo driver more than any case the
 * symptom reading guesses. Our choice; bench/search-judged.ts measures what it does.
 */
const RARE_SHARE = 0.01;
const RARE_MIN = 1;
/**
 * What holding every rare word adds: the most a case can score without (text 1 − SYMPTOM_WEIGHT
 * plus a perfect fit SYMPTOM_WEIGHT), so a case with all the rare words outranks every guess.
 */
const RARE_WEIGHT = 1;

/** Who may see a case, given its facts (the case policy's own test); moderators see everything. */
function factsVisibility(actor: Actor): (f: CaseFacts) => boolean {
  if (canModerate(actor)) return () => true;
  return (f) => canSeeCase(actor, { authorId: f.authorId, status: f.status });
}

/** Who may see what, as a test per case id; moderators see everything. */
export function visibilityOf(index: CaseIndex, actor: Actor): (id: number) => boolean {
  const seesFacts = factsVisibility(actor);
  return (id) => {
    const f = index.facts.get(id);
    return f !== undefined && seesFacts(f);
  };
}

/**
 * How well a case fits a symptom reading, in [0, 1]: the engine's likelihood for the cause the
 * case is filed under (less when only its engine diagnosis names it), scaled by how near the
 * case's own numbers are to the numbers the query stated.
 */
function symptomFit(reading: SymptomReading, f: CaseFacts): number {
  let cause = 0;
  for (const c of reading.causes) {
    if (f.cause === c.cause) cause = Math.max(cause, c.likelihood);
    else if (f.engineCause === c.cause) cause = Math.max(cause, ENGINE_CAUSE_MATCH * c.likelihood);
  }
  if (cause === 0) return 0;
  const numbers = symptomNumbersFit(reading.numbers, f.numbers);
  return cause * (numbers === undefined ? 0.8 : 0.4 + 0.6 * numbers);
}

/**
 * A case that holds the query's rare words gains up to RARE_WEIGHT (the share of the rare
 * words it holds), and joins the candidates if AND left it out: a word in one case in a
 * hundred says which case is meant more than a common word or the reading's guess does.
 * Rare: in at most RARE_SHARE of the cases; words the dictionary lacks count for nothing.
 */
function addRareWordBonus(index: CaseIndex, groups: TermGroup[], visible: (id: number) => boolean, scores: Map<number, number>) {
  const limit = Math.max(RARE_MIN, Math.floor(RARE_SHARE * index.size));
  const rare = groups.filter((g) => {
    // an irregular form is rare as written ("rang"), however common its base form ("ring")
    const written = g.terms.filter((t) => isWrittenFormTerm(t.term));
    const exact = written.length > 0 ? written : g.terms.filter((t) => t.weight === 1);
    if (exact.length === 0) return false;
    const df = Math.max(...exact.map((t) => index.engine.documentFrequency(t.term, limit)));
    return df > 0 && df <= limit;
  });
  if (rare.length === 0) return;
  const held = new Map<number, number>();
  for (const g of rare) for (const id of index.scoreGroup(g, visible).keys()) held.set(id, (held.get(id) ?? 0) + 1);
  for (const [id, n] of held) scores.set(id, (scores.get(id) ?? 0) + (RARE_WEIGHT * n) / rare.length);
}

/**
 * The search: words through the index, the symptom reading through the engine, blended.
 * score = text (normalised to the best match, times the share of words matched) when the
 * query is only words; with a reading, 0.4·text + 0.6·fit, and cases filed under an inferred
 * cause join the candidates even when they share no word with the query.
 * Facets count the visible candidates; each facet ignores its own filter (so picking one
 * cause still shows how many the other causes have).
 */
export function rankCases(index: CaseIndex, actor: Actor, query: SearchQuery, synonyms: Map<string, string>): RankedPage {
  const visible = visibilityOf(index, actor);
  const hasWords = query.q.trim() !== '';
  const groups = hasWords ? planQuery(query.q, index, synonyms) : [];
  const text = hasWords ? runTextQuery(index, groups, visible) : undefined;
  const reading = hasWords ? readSymptomQuery(query.q) : null;

  const scores = new Map<number, number>();
  if (text) {
    let best = 0;
    for (const s of text.scores.values()) if (s > best) best = s;
    for (const [id, s] of text.scores) scores.set(id, ((best > 0 ? s / best : 0) * text.coverage(id)) * (reading ? 1 - SYMPTOM_WEIGHT : 1));
  }
  if (reading && reading.causes.length > 0) {
    // only the cases filed (or diagnosed) under an inferred cause can fit: read them from the per-cause lists
    const seesFacts = factsVisibility(actor);
    const seen = new Set<number>();
    for (const c of reading.causes) {
      for (const id of index.casesOfCause(c.cause)) {
        if (seen.has(id)) continue;
        seen.add(id);
        // one lookup of the facts for both the fit and the policy: this loop meets thousands of cases
        const f = index.facts.get(id)!;
        const fit = symptomFit(reading, f);
        if (fit > 0 && seesFacts(f)) scores.set(id, (scores.get(id) ?? 0) + SYMPTOM_WEIGHT * fit);
      }
    }
  }
  if (hasWords) addRareWordBonus(index, groups, visible, scores);
  if (!hasWords) {
    const seesFacts = factsVisibility(actor);
    for (const [id, f] of index.facts) if (seesFacts(f)) scores.set(id, 0);
  }

  const { facets, passing } = countFacets(index, scores.keys(), query);
  const byUpdate = (a: Ranked, b: Ranked) => index.facts.get(b.id)!.updatedAt.localeCompare(index.facts.get(a.id)!.updatedAt);
  const ranked = passing.map((id) => ({ id, score: scores.get(id)! }));
  const start = (query.page - 1) * query.pageSize;
  const upTo = topK(ranked, start + query.pageSize, (a, b) => b.score - a.score || byUpdate(a, b) || b.id - a.id);
  return { page: upTo.slice(start), total: ranked.length, facets, reading, terms: text?.terms ?? new Set() };
}
