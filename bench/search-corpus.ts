import type { SearchSourceRow } from '../server/db/repositories/search-source';
import type { CaseStatus } from '../shared/schemas/case';
import { CAUSES as ALL_CAUSES } from '../shared/schemas/diagnosis';

// The corpus covers the first six causes; the rest have no generated phrases yet.
const CAUSES = ALL_CAUSES.slice(0, 6) as readonly FirstCause[];
type FirstCause = 'attenuation-mismatch' | 'termination-mismatch' | 'loading' | 'bandwidth' | 'compensation' | 'ground-lead';
type Cause = FirstCause;

/** Deterministic PRNG (mulberry32) so every run searches the same corpus. */
export function rng(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
export type Rand = ReturnType<typeof rng>;
export const pick = <T>(r: Rand, xs: readonly T[]): T => xs[Math.floor(r() * xs.length)];

// English function words lead any word-frequency list; they take the top ranks here too.
const FUNCTION = 'the of and to a in is it that was for on with as at by this we be from or an not but have had are were which when so then there after before than all if no its our into out up one also only'.split(' ');
const GENERAL = ('board test found check value again looked changed expected signal first noticed measured showed later second team week bench lab fixture build ' +
  'unit sample design revision part reading wrong right problem issue question answer hours days because while still even though really nothing ' +
  'something about around between under over same different new old high low long short small large fast slow good bad').split(' ');
export const DOMAIN = ('probe scope oscilloscope channel ground lead spring clip tip ringing overshoot undershoot edge edges rise fall time bandwidth limit ' +
  'attenuation compensation trimmer calibrator square wave sine clock gate drive mosfet node impedance source resistance capacitance input ' +
  'termination coax cable amplitude volts millivolts frequency mhz khz nanoseconds measurement trace display setting switch divider resistor ' +
  'capacitor loading buffer opamp regulator rail supply ripple noise spike spikes corner corners rounded damped oscillation resonance inductance ' +
  'loop return path reference differential active passive switchable ratio factor tenth decade nominal datasheet pickup coupling shield barrel ' +
  'socket header testpoint pad via trace ferrite choke converter buck boost inverter pwm spi i2c uart adc dac sensor thermistor crystal oscillator ' +
  'reset enable sag droop level bias offset dc ac rms peak vpp').split(' ');

/** A pronounceable made-up word per rank: the long tail of part names, jargon and people's words. */
function tailWord(rank: number): string {
  const c = 'bcdfghklmnprstvz';
  const v = 'aeiou';
  let n = rank * 7919 + 13;
  let w = '';
  for (let i = 0; i < 2 + (rank % 3); i++) {
    w += c[n % c.length] + v[Math.floor(n / 16) % v.length];
    n = Math.floor(n / 80) + i * 31 + rank;
  }
  return rank % 11 === 0 ? `${w}${rank % 97}` : w;
}

/** Vocabulary in frequency-rank order: function words, everyday words and trade terms, then the tail. */
export const VOCABULARY: string[] = (() => {
  const head = [...FUNCTION, ...GENERAL.flatMap((g, i) => (DOMAIN[i] ? [g, DOMAIN[i]] : [g])), ...DOMAIN.slice(GENERAL.length)];
  const seen = new Set(head);
  const tail: string[] = [];
  for (let rank = 1; tail.length < 40_000; rank++) {
    const w = tailWord(rank);
    if (!seen.has(w)) {
      seen.add(w);
      tail.push(w);
    }
  }
  return [...head, ...tail];
})();

/** Zipf sampler, P(rank k) ∝ 1/k^s: the word-frequency law of natural text (s ≈ 1). */
export function zipf(r: Rand, n = VOCABULARY.length, s = 1.0) {
  const cdf = new Float64Array(n);
  let sum = 0;
  for (let k = 0; k < n; k++) cdf[k] = sum += 1 / (k + 1) ** s;
  return () => {
    const x = r() * sum;
    let lo = 0;
    let hi = n - 1;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (cdf[mid] < x) lo = mid + 1;
      else hi = mid;
    }
    return VOCABULARY[lo];
  };
}

/** Phrases each cause's write-ups use, so the corpus has the shape real cases have. */
export const CAUSE_PHRASES: Record<Cause, string[]> = {
  'attenuation-mismatch': ['reads a tenth of the rail', '10x probe with the channel at 1x', 'amplitude ten times too small', 'switch on the probe was at x1', 'channel attenuation setting wrong'],
  'termination-mismatch': ['input set to 50 ohm', 'passive probe into a 50Ω input', 'trace almost flat', 'termination menu left on 50 ohm', 'amplitude thousands of times too small'],
  loading: ['dc level sags when probed', 'high impedance node pulled down', 'amplitude falls with frequency', '1x probe capacitance loads the node', 'divider output reads low'],
  bandwidth: ['edges rounded', 'rise time much slower than the datasheet', 'bandwidth limit filter left on', '20 MHz limit rounds the clock', 'slow edges on a fast driver'],
  compensation: ['spikes on square wave corners', 'rounded corners on the calibrator', 'trimmer out of adjustment', 'overshoot on every corner', 'probe moved between scopes without compensation'],
  'ground-lead': ['ringing after every edge', 'long ground lead rings', 'clip lead loop ringing at 150 MHz', 'ground spring removed the ringing', 'spring tip fixed the overshoot'],
};
const CAUSE_TAGS: Record<Cause, string[]> = {
  'attenuation-mismatch': ['10x-at-1x', 'switchable-probe', 'vertical-scale'],
  'termination-mismatch': ['50-ohm-input', 'passive-probe-into-50-ohm'],
  loading: ['high-impedance-node', '1x-probe-loading', 'rc-loading'],
  bandwidth: ['slow-edges', 'bandwidth-limit-filter', '1x-probe-bandwidth'],
  compensation: ['probe-compensation', 'calibrator', 'square-wave'],
  'ground-lead': ['long-ground-lead', 'ground-spring', 'ringing'],
};
const STATUSES = [['verified', 0.75], ['draft', 0.08], ['in_review', 0.08], ['needs_changes', 0.05], ['retired', 0.04]] as const;

function status(r: Rand): CaseStatus {
  let x = r();
  for (const [s, p] of STATUSES) if ((x -= p) < 0) return s;
  return 'verified';
}

function setupFor(r: Rand, cause: Cause): object {
  const f = 10 ** (3 + r() * 5);
  switch (cause) {
    case 'attenuation-mismatch': return { probe: { attenuation: 10 }, scope: { attenuationSetting: 1 }, signal: { expectedAmplitudeV: 3.3, frequencyHz: f }, observed: { amplitudeV: 0.33 } };
    case 'termination-mismatch': return { probe: { attenuation: 10 }, scope: { inputResistanceOhm: 50 }, signal: { expectedAmplitudeV: 5 }, observed: { amplitudeV: 0.0003 } };
    case 'loading': return { circuit: { sourceResistanceOhm: 10 ** (4 + r() * 2) }, signal: { expectedAmplitudeV: 2.5, kind: 'dc' }, observed: { amplitudeV: 2.5 * (0.6 + r() * 0.35) } };
    case 'bandwidth': return { scope: { bandwidthHz: 1e8 }, signal: { riseTimeS: 1e-9, kind: 'square', frequencyHz: f }, observed: { riseTimeS: (5 + r() * 40) * 1e-9 } };
    case 'compensation': return { signal: { kind: 'square', frequencyHz: 1e3 }, observed: { overshootPct: (r() < 0.6 ? 1 : -1) * (5 + r() * 30) } };
    case 'ground-lead': return { probe: { groundLeadM: 0.05 + r() * 0.2 }, signal: { kind: 'square', frequencyHz: f }, observed: { ringingFrequencyHz: (60 + r() * 240) * 1e6 } };
  }
}

/** 10,000 cases by default: 300–800 words each, trade phrases over a Zipf-distributed vocabulary. */
export function generateCorpus(count = 10_000, seed = 20261201): { rows: SearchSourceRow[]; tags: Map<number, string[]> } {
  const r = rng(seed);
  const word = zipf(r);
  const words = (n: number, cause: Cause) => {
    const out: string[] = [];
    while (out.length < n) {
      const x = r();
      if (x < 0.03) out.push(...pick(r, CAUSE_PHRASES[cause]).split(' '));
      else if (x < 0.13) out.push(pick(r, DOMAIN));
      else out.push(word());
    }
    return out.slice(0, n);
  };
  const sentences = (ws: string[]) => ws.reduce((text, w, i) => text + (i === 0 ? w[0].toUpperCase() + w.slice(1) : i % 14 === 13 ? `. ${w}` : ` ${w}`), '') + '.';
  const rows: SearchSourceRow[] = [];
  const tags = new Map<number, string[]>();
  for (let id = 1; id <= count; id++) {
    const cause = pick(r, CAUSES);
    const total = 300 + Math.floor(r() * 501);
    const title = `${pick(r, CAUSE_PHRASES[cause])} ${words(3 + Math.floor(r() * 4), cause).join(' ')}`;
    const summary = sentences(words(12 + Math.floor(r() * 14), cause));
    const fix = sentences(words(15 + Math.floor(r() * 20), cause));
    const lesson = `${pick(r, CAUSE_PHRASES[cause])} ${words(8, cause).join(' ')}`;
    const used = [title, summary, fix, lesson].join(' ').split(' ').length;
    const day = new Date(Date.UTC(2024, 0, 1) + id * 3_600_000).toISOString();
    rows.push({
      id, author_id: 1 + Math.floor(r() * 40), status: status(r), title, summary,
      narrative: sentences(words(Math.max(50, total - used), cause)),
      setup: JSON.stringify(setupFor(r, cause)), stated_cause: cause, stated_cause_other: null, cause, engine_cause: cause,
      fix, lesson_summary: lesson, lesson_detail: null, updated_at: day,
    });
    tags.set(id, [cause, ...CAUSE_TAGS[cause].filter(() => r() < 0.5)]);
  }
  return { rows, tags };
}
