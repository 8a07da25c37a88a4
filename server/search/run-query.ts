import type { CaseIndex, TermGroup } from './case-index';

export interface TextResult {
  /** Text score per matching case. */
  scores: Map<number, number>;
  /** Share of the query's words each case has: 1 for all under AND. */
  coverage: (id: number) => number;
  /** Index terms the query stood for, to mark in highlights. */
  terms: Set<string>;
  /** `and` when every word had to match; `or` after falling back because no case had them all. */
  mode: 'and' | 'or' | 'none';
}

const NONE: TextResult = { scores: new Map(), coverage: () => 0, terms: new Set(), mode: 'none' };

/**
 * Runs a planned query.
 *
 * AND first, planned the way a database plans a join: the cheapest word is scored first, and
 * every later word only over the cases still in the running, so a common word costs what
 * the rare one leaves of it. When no case has every word: OR, each word over all visible
 * cases, a case's score summed over its words and multiplied by how many it has (as
 * minisearch does), so cases with more of the words come first.
 */
export function runTextQuery(index: CaseIndex, groups: TermGroup[], visible: (id: number) => boolean): TextResult {
  if (groups.length === 0) return NONE;
  const terms = new Set(groups.flatMap((g) => g.terms.map((t) => t.term)));
  const ordered = groups.map((g) => ({ g, cost: index.groupCost(g) })).sort((a, b) => a.cost - b.cost);

  let scores: Map<number, number> | undefined;
  for (const { g } of ordered) {
    if (g.terms.length === 0) {
      scores = undefined;
      break;
    }
    const current: Map<number, number> | undefined = scores;
    const hits = index.scoreGroup(g, current ? (id) => current.has(id) : visible);
    if (current) for (const [id, s] of hits) hits.set(id, s + current.get(id)!);
    scores = hits;
    if (scores.size === 0) break;
  }
  if (scores && scores.size > 0) return { scores, coverage: () => 1, terms, mode: 'and' };
  if (groups.length === 1) return NONE;

  const sum = new Map<number, number>();
  const count = new Map<number, number>();
  for (const { g } of ordered) {
    if (g.terms.length === 0) continue;
    for (const [id, s] of index.scoreGroup(g, visible)) {
      sum.set(id, (sum.get(id) ?? 0) + s);
      count.set(id, (count.get(id) ?? 0) + 1);
    }
  }
  for (const [id, s] of sum) sum.set(id, s * count.get(id)!);
  const n = groups.length;
  return sum.size ? { scores: sum, coverage: (id) => (count.get(id) ?? 0) / n, terms, mode: 'or' } : NONE;
}
