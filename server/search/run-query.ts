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

  const and = andScores(index, ordered.map((o) => o.g), visible);
  if (and && and.size > 0) return { scores: and, coverage: () => 1, terms, mode: 'and' };
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

/**
 * Cases holding every group, with their summed scores; undefined when a group has no terms.
 * Scored by slot into arrays: the first (cheapest) group over the visible slots, each later
 * group only over the slots still in the running. Visibility is asked once per slot.
 */
function andScores(index: CaseIndex, ordered: TermGroup[], visible: (id: number) => boolean): Map<number, number> | undefined {
  if (ordered.some((g) => g.terms.length === 0)) return undefined;
  const engine = index.engine;
  const slots = engine.slotCount;
  // 0 not asked yet, 1 visible, 2 not
  const seen = new Uint8Array(slots);
  const admitVisible = (slot: number) => {
    let v = seen[slot];
    if (v === 0) seen[slot] = v = visible(engine.idAt(slot)) ? 1 : 2;
    return v === 1;
  };
  let total = new Float64Array(slots);
  let inRunning: number[] = [];
  index.scoreGroupSlots(ordered[0], admitVisible, total, inRunning);
  for (let k = 1; k < ordered.length && inRunning.length > 0; k++) {
    const running = total;
    const group = new Float64Array(slots);
    const touched: number[] = [];
    index.scoreGroupSlots(ordered[k], (slot) => running[slot] > 0, group, touched);
    for (const slot of touched) group[slot] += running[slot];
    total = group;
    inRunning = touched;
  }
  const scores = new Map<number, number>();
  for (const slot of inRunning) scores.set(engine.idAt(slot), total[slot]);
  return scores;
}
