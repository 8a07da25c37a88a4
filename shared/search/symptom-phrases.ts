/**
 * What a symptom query says, phrase by phrase: "10x too small", "reads a tenth",
 * "ringing at 120 MHz", "15% overshoot", "edges rounded". Each rule turns a phrase into a
 * fact; `symptom-query.ts` turns the facts into an engine input.
 */

export type Fact =
  | { kind: 'amplitude'; ratio: number; stated?: false }
  | { kind: 'ringing'; hz?: number }
  | { kind: 'overshoot'; pct: number; stated: boolean }
  | { kind: 'slow-edges'; riseS?: number }
  | { kind: 'roll-off' }
  | { kind: 'dc-sag' }
  | { kind: 'frequency'; hz: number }
  | { kind: 'probe'; ratio: number }
  | { kind: 'setting'; ratio: number }
  | { kind: 'input'; ohm: number }
  | { kind: 'ground-lead'; m: number }
  | { kind: 'bandwidth-limit'; hz: number }
  | { kind: 'square' }
  | { kind: 'alias'; shownHz?: number; signalHz?: number }
  | { kind: 'clipped' }
  | { kind: 'tilt'; pct?: number }
  | { kind: 'hum'; hz?: number }
  | { kind: 'ac-coupling' };

/** Facts that describe the trace itself; the rest only describe the setup around it. */
export const SYMPTOM_KINDS: ReadonlySet<Fact['kind']> = new Set([
  'amplitude',
  'ringing',
  'overshoot',
  'slow-edges',
  'roll-off',
  'dc-sag',
  'alias',
  'clipped',
  'tilt',
  'hum',
]);

const NUM = String.raw`(\d+(?:\.\d+)?)`;
const WORD_RATIO: Record<string, number> = { ten: 10, hundred: 100, thousand: 1000 };
const FRACTIONS: Record<string, number> = { tenth: 0.1, hundredth: 0.01, thousandth: 0.001, half: 0.5, third: 1 / 3, quarter: 0.25, fifth: 0.2 };
const SMALL = '(?:small|low|little|short|smaller|lower|weak|less)';
const BIG = '(?:big|large|high|tall|larger|bigger|higher|strong)';
const TIMES = String.raw`(?:${NUM}\s*(?:x|×|times)|(?:x|×)\s*(\d+)|\b(ten|hundred|thousand)\s+times)`;

/** Hertz from a number and a prefix letter; queries write "mhz" for megahertz, so m is mega here. */
const hertz = (n: string, prefix = '') => Number(n) * ({ '': 1, k: 1e3, m: 1e6, g: 1e9 }[prefix] ?? 1);
const seconds = (n: string, unit: string) => Number(n) * ({ ps: 1e-12, ns: 1e-9, us: 1e-6, µs: 1e-6, ms: 1e-3, s: 1 }[unit] ?? 1);
const volts = (n: string, unit: string) => Number(n) * ({ mv: 1e-3, v: 1, kv: 1e3 }[unit] ?? 1);
const metres = (n: string, unit: string) => Number(n) * ({ mm: 1e-3, cm: 1e-2, in: 0.0254, m: 1 }[unit] ?? 1);
const timesOf = (m: RegExpMatchArray) => Number(m[1] ?? m[2] ?? WORD_RATIO[m[3]]);
/** "a few" stands for 3 of a unit (our choice); a bare prefix ("where the clock is MHz") for 1. */
const FEW = 3;
const hertzOrFew = (n: string | undefined, prefix: string | undefined) => hertz(n === undefined ? '1' : n === 'a few' ? String(FEW) : n, prefix);
/** A shown frequency below the true one is an alias; anything else is not read as one. */
const aliasFacts = (shownHz: number, signalHz: number): Fact[] => (shownHz < signalHz ? [{ kind: 'alias', shownHz, signalHz }] : []);

interface Rule {
  re: RegExp;
  facts: (m: RegExpMatchArray) => Fact[];
}

const V = String.raw`${NUM}\s*(mv|v|kv)\b`;

/** A frequency, "a few kHz", or a bare prefix ("MHz"); `FREQ_STATED` needs the number. */
const FREQ = String.raw`(a few|${NUM})?\s*(k|m|g)?hz\b`;
const FREQ_STATED = String.raw`(a few|${NUM})\s*(k|m|g)?hz\b`;

// Ordered: a phrase a rule consumes is not read again by a later, looser rule.
const RULES: Rule[] = [
  // acquisition symptoms first: their words ("droop", "clip", "kHz") are read more loosely below
  { re: new RegExp(String.raw`\b(?:hum|buzz)\w*\s+(?:at\s+|of\s+)?${NUM}\s*hz\b|${NUM}\s*hz\s+(?:hum|buzz|pickup|noise)`), facts: (m) => [{ kind: 'hum', hz: Number(m[1] ?? m[2]) }] },
  { re: /\bhum(?:s|ming)?\b|\bground\s+loops?\b|\bmains\s+(?:noise|pickup|interference)/, facts: () => [{ kind: 'hum' }] },
  { re: new RegExp(String.raw`${FREQ_STATED}[^.]{0,40}?\b(?:where|instead of|but|while|though|although|when)\b[^.]{0,40}?\b${FREQ}`), facts: (m) => aliasFacts(hertzOrFew(m[1], m[3]), hertzOrFew(m[4], m[6])) },
  { re: /\blooks?\s+slower\s+than\s+it\s+is|\bsample\s*rate\s+(?:is\s+|was\s+)?too\s+low|\bunder-?sampl\w*|\balias\w*|\btoo\s+few\s+samples/, facts: () => [{ kind: 'alias' }] },
  { re: /\btops?\s+(?:are\s+|look\s+|got\s+)?(?:flat(?:tened)?|cut(?:\s+off)?|chopped|squashed)|\bflat(?:tened)?\s+tops?|\bclipp(?:ed|ing)\b|\bcut\s+off\s+at\s+the\s+(?:top|bottom|edge)|\b(?:runs?|goes|went)\s+off\s+(?:the\s+)?(?:top|bottom|screen)/, facts: () => [{ kind: 'clipped' }] },
  { re: /\bac[\s-]*coupl\w*\s+(?:droop\w*|tilt\w*|sag\w*)/, facts: () => [{ kind: 'tilt' }, { kind: 'ac-coupling' }, { kind: 'square' }] },
  { re: new RegExp(String.raw`${NUM}\s*%\s*(?:droop|tilt|sag)|(?:droop|tilt)\w*\s+(?:of\s+|by\s+|about\s+)?${NUM}\s*%`), facts: (m) => [{ kind: 'tilt', pct: Number(m[1] ?? m[2]) }, { kind: 'square' }] },
  { re: /\btops?\s+(?:are\s+|look\s+)?(?:droop\w*|tilt\w*|sag\w*|slop\w*)|\b(?:droop\w*|tilt\w*|sloping)\s+tops?/, facts: () => [{ kind: 'tilt' }, { kind: 'square' }] },
  { re: /\bac[\s-]*coupl\w*/, facts: () => [{ kind: 'ac-coupling' }] },
  { re: /\b(?:reads?|shows?|displays?|measures?)\s+(?:about\s+)?(?:double|twice)\b|\bdouble\s+the\s+(?:set|expected)\b|\btwice\s+(?:the\s+)?(?:set\s+|expected\s+)?(?:amplitude|voltage|level)/, facts: () => [{ kind: 'amplitude', ratio: 2 }] },
  { re: new RegExp(String.raw`${V}\s*(?:instead of|rather than|not|vs\.?|versus|against|but expected|expected)\s*${V}`), facts: (m) => [{ kind: 'amplitude', ratio: volts(m[1], m[2]) / volts(m[3], m[4]) }] },
  { re: new RegExp(String.raw`expected\s+${V}.{0,40}?\b(?:got|reads?|saw|see|shows?|showed|measured|displays?)\s+${V}`), facts: (m) => [{ kind: 'amplitude', ratio: volts(m[3], m[4]) / volts(m[1], m[2]) }] },
  { re: new RegExp(String.raw`${TIMES}\s+(?:too\s+)?${SMALL}\b`), facts: (m) => [{ kind: 'amplitude', ratio: 1 / timesOf(m) }] },
  { re: new RegExp(String.raw`${TIMES}\s+(?:too\s+)?${BIG}\b`), facts: (m) => [{ kind: 'amplitude', ratio: timesOf(m) }] },
  { re: /\b(?:an?|one)\s+(tenth|hundredth|thousandth|half|third|quarter|fifth)\b/, facts: (m) => [{ kind: 'amplitude', ratio: FRACTIONS[m[1]] }] },
  { re: /\b(?:reads?|shows?|displays?|only|just)\s+(half|a third|a quarter)\b/, facts: (m) => [{ kind: 'amplitude', ratio: FRACTIONS[m[1].replace(/^a /, '')] }] },
  { re: new RegExp(String.raw`${NUM}\s*%\s+of\s+(?:the\s+)?(?:expected|true|real|actual|nominal|signal|amplitude|what)`), facts: (m) => [{ kind: 'amplitude', ratio: Number(m[1]) / 100 }] },
  { re: /\b(?:off\s+by\s+(?:a\s+)?(?:round\s+)?(?:factor|decade)|round\s+factor)\b/, facts: () => [{ kind: 'amplitude', ratio: 0.1, stated: false }] },
  { re: /\b1\s*\/\s*(\d+)\b(?!\s*[x×])/, facts: (m) => [{ kind: 'amplitude', ratio: 1 / Number(m[1]) }] },
  { re: new RegExp(String.raw`\b(?:ring\w*|oscillat\w*|resonan\w*)\s+(?:at|of|around|near|about|~|@)?\s*${NUM}\s*(k|m|g)?hz\b`), facts: (m) => [{ kind: 'ringing', hz: hertz(m[1], m[2]) }, { kind: 'square' }] },
  { re: new RegExp(String.raw`${NUM}\s*(k|m|g)?hz\s+(?:ring\w*|oscillat\w*)`), facts: (m) => [{ kind: 'ringing', hz: hertz(m[1], m[2]) }, { kind: 'square' }] },
  { re: /\b(?:ring(?:s|ing)?|oscillat\w*)\b/, facts: () => [{ kind: 'ringing' }, { kind: 'square' }] },
  { re: new RegExp(String.raw`${NUM}\s*%\s*(overshoot|undershoot)`), facts: (m) => [{ kind: 'overshoot', pct: (m[2] === 'undershoot' ? -1 : 1) * Number(m[1]), stated: true }, { kind: 'square' }] },
  { re: new RegExp(String.raw`(overshoot|undershoot)s?\s+(?:of\s+|by\s+|about\s+)?${NUM}\s*%`), facts: (m) => [{ kind: 'overshoot', pct: (m[1] === 'undershoot' ? -1 : 1) * Number(m[2]), stated: true }, { kind: 'square' }] },
  { re: /\b(?:spik\w*|peak\w*|pointy|sharp)\b[^.]{0,30}\bcorners?\b|\bcorners?\b[^.]{0,20}\b(?:spik\w*|peak\w*|overshoot\w*)/, facts: () => [{ kind: 'overshoot', pct: 20, stated: false }, { kind: 'square' }] },
  { re: /\brounded\s+corners?|\bcorners?\s+(?:are\s+|look\s+)?rounded|\bdroop\w*|\bundershoot\w*|\btilt\w*\s+tops?/, facts: () => [{ kind: 'overshoot', pct: -20, stated: false }, { kind: 'square' }] },
  { re: /\bovershoot\w*/, facts: () => [{ kind: 'overshoot', pct: 20, stated: false }, { kind: 'square' }] },
  { re: new RegExp(String.raw`rise\s*time\s+(?:of\s+|is\s+|about\s+|around\s+)?${NUM}\s*(ps|ns|µs|us|ms)\b`), facts: (m) => [{ kind: 'slow-edges', riseS: seconds(m[1], m[2]) }] },
  { re: new RegExp(String.raw`${NUM}\s*(ps|ns|µs|us|ms)\s+(?:rise|edge)`), facts: (m) => [{ kind: 'slow-edges', riseS: seconds(m[1], m[2]) }] },
  { re: /\bedges?\s+(?:are\s+|look\s+|got\s+)?(?:rounded|slow\w*|soft|smeared|sluggish)|\b(?:rounded|slow|soft|sluggish|smeared)\s+(?:edges?|rise\w*)|\bslow\s+rise\w*/, facts: () => [{ kind: 'slow-edges' }] },
  { re: /\bamplitude\s+(?:falls?|drops?|decreases?|rolls?\s+off|shrinks?|goes\s+down|lower\w*)\s+(?:with|at|as)\s+(?:higher\s+|increasing\s+|rising\s+)?frequenc\w*|\brolls?\s+off\b|\bloses?\s+amplitude\s+at\s+high/, facts: () => [{ kind: 'roll-off' }] },
  { re: /\b(?:dc|voltage|level|rail|bias)\b[^.]{0,20}?\b(?:sags?|sagging|droops?|reads?\s+low|pulled\s+down|dips?)\b|\bsag(?:s|ging)?\b/, facts: () => [{ kind: 'dc-sag' }] },
  { re: new RegExp(String.raw`${NUM}\s*x\s+probe\s+(?:at|on|read\s+as|with\s+the\s+channel\s+(?:at|set\s+to))\s+(?:an?\s+)?${NUM}\s*x\b`), facts: (m) => [{ kind: 'probe', ratio: Number(m[1]) }, { kind: 'setting', ratio: Number(m[2]) }] },
  { re: new RegExp(String.raw`\b(?:channel|scope|ch\d?)\s+(?:set\s+)?(?:to|at|on)\s+${NUM}\s*x\b`), facts: (m) => [{ kind: 'setting', ratio: Number(m[1]) }] },
  { re: new RegExp(String.raw`${NUM}\s*x\s+probe\b`), facts: (m) => [{ kind: 'probe', ratio: Number(m[1]) }] },
  { re: /(?:into|on|at|to)\s+(?:an?\s+|the\s+)?50\s*(?:ω|ohms?)|\b50\s*(?:ω|ohms?)\s+(?:input|termination|terminat\w*|setting|mode)/, facts: () => [{ kind: 'input', ohm: 50 }] },
  { re: new RegExp(String.raw`${NUM}\s*(mm|cm|in)\s+(?:long\s+)?ground\s*(?:lead|clip|wire)`), facts: (m) => [{ kind: 'ground-lead', m: metres(m[1], m[2]) }, { kind: 'square' }] },
  { re: /\blong\s+ground\s*(?:lead|clip|wire)|\bground\s*clip\b|\balligator\b/, facts: () => [{ kind: 'ground-lead', m: 0.15 }, { kind: 'square' }] },
  { re: new RegExp(String.raw`(?:${NUM}\s*mhz\s+)?(?:bw|bandwidth)[\s-]*limit`), facts: (m) => [{ kind: 'bandwidth-limit', hz: m[1] ? hertz(m[1], 'm') : 20e6 }] },
  { re: new RegExp(String.raw`${NUM}\s*(k|m|g)?hz\b`), facts: (m) => [{ kind: 'frequency', hz: hertz(m[1], m[2]) }] },
  { re: /square[\s-]?waves?|\bclock\b|\bcalibrator\b|\bcorners?\b|\bedges?\b/, facts: () => [{ kind: 'square' }] },
];

/** The facts a query states, in reading order of the rules; each phrase is read once. */
export function readFacts(query: string): Fact[] {
  let text = query.normalize('NFKC').toLowerCase().replace(/\s+/g, ' ');
  const facts: Fact[] = [];
  for (const rule of RULES) {
    const m = text.match(rule.re);
    if (!m || m.index === undefined) continue;
    const found = rule.facts(m).filter((f) => !('ratio' in f) || (Number.isFinite(f.ratio) && f.ratio > 0));
    facts.push(...found);
    text = text.slice(0, m.index) + ' '.repeat(m[0].length) + text.slice(m.index + m[0].length);
  }
  return facts;
}
