import { canSeeCase } from '../../shared/auth/case-policy';
import { canModerate, type Actor } from '../../shared/auth/roles';
import { symptomNumbersFit } from '../../shared/search/case-numbers';
import { isWrittenFormTerm } from '../../shared/search/stem';
import { readSymptomQuery, type SymptomReading } from '../../shared/search/symptom-query';
import type { SearchQuery } from '../../shared/schemas/search';
import type { CaseStatus } from '../../shared/schemas/case';
import type { CaseIndex, TermGroup } from './case-index';
import { FACET_ROW, ROW_AUTHOR, ROW_CAUSE, ROW_ENGINE_CAUSE, ROW_STATUS } from './facet-rows';
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

/** Who may see the case in a row of `index.facetRows`, by the case policy; moderators see everything. */
function rowVisibility(index: CaseIndex, actor: Actor): (row: number) => boolean {
  if (canModerate(actor)) return () => true;
  const rows = index.facetRows;
  return (row) => {
    const at = row * FACET_ROW;
    return canSeeCase(actor, { authorId: rows.meta[at + ROW_AUTHOR], status: index.facetName(rows.meta[at + ROW_STATUS]) as CaseStatus });
  };
}

/** Who may see what, as a test per case id; moderators see everything. */
export function visibilityOf(index: CaseIndex, actor: Actor): (id: number) => boolean {
  const seesRow = rowVisibility(index, actor);
  const rows = index.facetRows;
  return (id) => {
    const row = rows.rowOf(id);
    return row >= 0 && seesRow(row);
  };
}

/** An inferred cause as the index's code for it, with the engine's likelihood. */
interface CodedCause {
  code: number;
  likelihood: number;
}

/**
 * How well a case's cause fits a symptom reading, in [0, 1]: the engine's likelihood for the
 * cause the case is filed under, less when only its engine diagnosis names it.
 */
function causeFit(causes: CodedCause[], causeCode: number, engineCauseCode: number): number {
  let fit = 0;
  for (const c of causes) {
    if (causeCode === c.code) fit = Math.max(fit, c.likelihood);
    else if (engineCauseCode === c.code) fit = Math.max(fit, ENGINE_CAUSE_MATCH * c.likelihood);
  }
  return fit;
}

/** The cause's fit scaled by how near the case's own numbers are to the numbers the query stated (none stated: 0.8). */
const withNumbers = (cause: number, numbers: number | undefined) => cause * (numbers === undefined ? 0.8 : 0.4 + 0.6 * numbers);

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
    // only the cases filed (or diagnosed) under an inferred cause can fit: read them from the per-cause lists,
    // their causes, author and status from their packed rows (this loop meets thousands of cases)
    const rows = index.facetRows;
    const seesRow = rowVisibility(index, actor);
    // a cause no case has has no code: nothing can match it
    const coded = reading.causes.map((c) => ({ code: index.knownCode(c.cause), likelihood: c.likelihood })).filter((c) => c.code >= 0);
    const statesNumbers = Object.values(reading.numbers).some((v) => v !== undefined);
    const seen = new Set<number>();
    for (const c of reading.causes) {
      for (const id of index.casesOfCause(c.cause)) {
        if (seen.has(id)) continue;
        seen.add(id);
        const row = rows.rowOf(id);
        if (row < 0) continue;
        const at = row * FACET_ROW;
        const cause = causeFit(coded, rows.meta[at + ROW_CAUSE], rows.meta[at + ROW_ENGINE_CAUSE]);
        if (cause === 0 || !seesRow(row)) continue;
        const fit = withNumbers(cause, statesNumbers ? symptomNumbersFit(reading.numbers, index.facts.get(id)!.numbers) : undefined);
        scores.set(id, (scores.get(id) ?? 0) + SYMPTOM_WEIGHT * fit);
      }
    }
  }
  if (hasWords) addRareWordBonus(index, groups, visible, scores);
  if (!hasWords) for (const id of index.facts.keys()) if (visible(id)) scores.set(id, 0);

  const { facets, passing } = countFacets(index, scores.keys(), query);
  const byUpdate = (a: Ranked, b: Ranked) => index.facts.get(b.id)!.updatedAt.localeCompare(index.facts.get(a.id)!.updatedAt);
  const ranked = passing.map((id) => ({ id, score: scores.get(id)! }));
  const start = (query.page - 1) * query.pageSize;
  const upTo = topK(ranked, start + query.pageSize, (a, b) => b.score - a.score || byUpdate(a, b) || b.id - a.id);
  return { page: upTo.slice(start), total: ranked.length, facets, reading, terms: text?.terms ?? new Set() };
}
