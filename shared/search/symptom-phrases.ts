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
  | { kind: 'square' };

/** Facts that describe the trace itself; the rest only describe the setup around it. */
export const SYMPTOM_KINDS: ReadonlySet<Fact['kind']> = new Set(['amplitude', 'ringing', 'overshoot', 'slow-edges', 'roll-off', 'dc-sag']);

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

interface Rule {
  re: RegExp;
  facts: (m: RegExpMatchArray) => Fact[];
}

const V = String.raw`${NUM}\s*(mv|v|kv)\b`;

// Ordered: a phrase a rule consumes is not read again by a later, looser rule.
const RULES: Rule[] = [
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
