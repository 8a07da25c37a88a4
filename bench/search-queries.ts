import { CAUSE_PHRASES, DOMAIN, VOCABULARY, pick, rng } from './search-corpus';

const TYPOS = ['ringnig', 'compnesation', 'atenuation', 'bandwith', 'overshot', 'termnation', 'osciloscope', 'capacitence', 'inductence', 'calibrater'];
const SYMPTOMS = ['10x too small', 'reads a tenth', 'ringing at 120 MHz', '15% overshoot on the square wave corners', 'edges rounded', 'amplitude falls with frequency', 'dc level sags', 'spikes on corners'];
const STOPWORDY = ['probe on the clock', 'what the scope showed', 'it was the ground', 'the edge of the clock', 'when the probe was on the rail'];

export interface BenchQuery {
  q: string;
  /** Engineer (sees verified and their own) or moderator (sees all). */
  as: { role: 'engineer' | 'moderator'; id: number };
  kind: string;
}

/** The fixed 200-query mix: what people type at the Bench, in proportions we expect (our estimate). */
export function queryMix(seed = 4242): BenchQuery[] {
  const r = rng(seed);
  const tail = () => VOCABULARY[200 + Math.floor(r() ** 2 * 30_000)];
  const domain = () => pick(r, DOMAIN);
  const make: [string, number, () => string][] = [
    ['one trade word', 30, domain],
    ['two or three trade words', 40, () => Array.from({ length: 2 + Math.floor(r() * 2) }, domain).join(' ')],
    ['symptom phrase', 25, () => (r() < 0.6 ? pick(r, SYMPTOMS) : pick(r, Object.values(CAUSE_PHRASES).flat()))],
    ['typing a word', 30, () => {
      const w = pick(r, DOMAIN.filter((d) => d.length >= 6));
      const cut = w.slice(0, 3 + Math.floor(r() * (w.length - 3)));
      return r() < 0.4 ? `${domain()} ${cut}` : cut;
    }],
    ['misspelling', 20, () => (r() < 0.5 ? pick(r, TYPOS) : `${domain()} ${pick(r, TYPOS)} `)],
    ['rare word', 25, () => (r() < 0.5 ? tail() : `${tail()} ${domain()}`)],
    ['with function words', 15, () => pick(r, STOPWORDY)],
    ['long query', 15, () => Array.from({ length: 5 + Math.floor(r() * 3) }, () => (r() < 0.6 ? domain() : VOCABULARY[Math.floor(r() * 600)])).join(' ')],
  ];
  const out: BenchQuery[] = [];
  for (const [kind, n, gen] of make) {
    for (let i = 0; i < n; i++) {
      const q = gen();
      // a query ends in a space when the word is finished, as it does when typed
      const finished = kind === 'typing a word' ? q : `${q} `;
      out.push({ q: finished, kind, as: r() < 0.5 ? { role: 'engineer', id: 1 + Math.floor(r() * 40) } : { role: 'moderator', id: 999 } });
    }
  }
  // interleave kinds so warm-up effects do not favour one kind
  return out.map((q) => ({ q, k: r() })).sort((a, b) => a.k - b.k).map((x) => x.q);
}
