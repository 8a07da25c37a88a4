import { numbersSimilarity } from '../../shared/search/case-numbers';
import { isWrittenFormTerm } from '../../shared/search/stem';
import { indexTerms } from '../../shared/search/text-terms';
import type { CaseIndex, TermGroup } from './case-index';
import type { Ranked } from './rank';

export interface SimilarSource {
  id: number;
  title: string;
  summary: string;
}

/** Words of a case's headline used to find others like it: its rarest ones. */
const TEXT_TERMS = 10;
const TEXT_CANDIDATES = 100;
const WEIGHTS = { cause: 0.4, numbers: 0.35, text: 0.25 } as const;
/** Below this a case is not offered as similar (our choice). */
const MIN_SCORE = 0.3;

/**
 * Cases like this one: the same cause (stated or diagnosed), nearby numbers (setup and
 * observation, compared in decades), and shared rare words from the title and summary.
 * score = 0.4·cause + 0.35·numbers + 0.25·text, each in [0, 1]; retired cases are left out.
 */
export function similarCases(index: CaseIndex, source: SimilarSource, visible: (id: number) => boolean, limit = 5): Ranked[] {
  const base = index.facts.get(source.id);
  if (!base) return [];
  const allow = (id: number) => id !== source.id && visible(id) && index.facts.get(id)?.status !== 'retired';

  const words = [...new Set(indexTerms(`${source.title} ${source.summary} ${base.tags.join(' ')}`))]
    // words by their base form: a written-form term would only repeat one already here
    .filter((term) => !isWrittenFormTerm(term))
    .map((term) => ({ term, postings: index.engine.postings(term) }))
    .filter((t) => t.postings > 0)
    .sort((a, b) => a.postings - b.postings)
    .slice(0, TEXT_TERMS);
  const group: TermGroup = { word: 'similar', terms: words.map((w) => ({ term: w.term, weight: 1 })) };
  const text = words.length ? index.scoreGroup(group, allow) : new Map<number, number>();
  const topText = [...text].sort((a, b) => b[1] - a[1]).slice(0, TEXT_CANDIDATES);
  const best = topText[0]?.[1] ?? 0;

  const candidates = new Map<number, number>(topText.map(([id, s]) => [id, best > 0 ? s / best : 0]));
  // the cases of the same cause, read from the per-cause lists rather than every case
  for (const c of new Set([base.cause, base.engineCause])) {
    if (!c) continue;
    for (const id of index.casesOfCause(c)) {
      const f = index.facts.get(id)!;
      const sameCause = (base.cause && (f.cause === base.cause || f.engineCause === base.cause)) || (base.engineCause && f.cause === base.engineCause);
      if (sameCause && allow(id) && !candidates.has(id)) candidates.set(id, 0);
    }
  }

  const scored: Ranked[] = [];
  for (const [id, textScore] of candidates) {
    const f = index.facts.get(id)!;
    const cause = base.cause && f.cause === base.cause ? 1 : (base.cause && f.engineCause === base.cause) || (base.engineCause && f.cause === base.engineCause) ? 0.6 : 0;
    const score = WEIGHTS.cause * cause + WEIGHTS.numbers * numbersSimilarity(base.numbers, f.numbers) + WEIGHTS.text * textScore;
    if (score >= MIN_SCORE) scored.push({ id, score });
  }
  return scored.sort((a, b) => b.score - a.score || b.id - a.id).slice(0, limit);
}
