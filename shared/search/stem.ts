/**
 * Inflection stripping so that "rings", "ringing" and "ring" meet in one index term.
 * Only the inflectional steps (plural, -ed, -ing, final y) of the Porter suffix-stripping
 * algorithm: derivational suffixes ("-ation") stay, so stems remain readable words.
 * source: M. F. Porter, "An algorithm for suffix stripping", Program 14(3), 1980, steps 1a–1c
 */
export function stem(word: string): string {
  const irregular = IRREGULAR.get(word);
  if (irregular) return irregular;
  if (word.length <= 3 || !/^[a-z]+$/.test(word)) return word;
  let w = step1a(word);
  w = step1b(w);
  return step1c(w);
}

const isConsonant = (w: string, i: number): boolean => {
  const c = w[i];
  if ('aeiou'.includes(c)) return false;
  if (c === 'y') return i === 0 || !isConsonant(w, i - 1);
  return true;
};

/** Porter's measure m: the number of vowel–consonant sequences in the stem. */
function measure(w: string): number {
  let m = 0;
  let i = 0;
  const n = w.length;
  while (i < n && isConsonant(w, i)) i++;
  while (i < n) {
    while (i < n && !isConsonant(w, i)) i++;
    if (i >= n) break;
    while (i < n && isConsonant(w, i)) i++;
    m++;
  }
  return m;
}

const hasVowel = (w: string) => {
  for (let i = 0; i < w.length; i++) if (!isConsonant(w, i)) return true;
  return false;
};
const endsDoubleConsonant = (w: string) => w.length >= 2 && w[w.length - 1] === w[w.length - 2] && isConsonant(w, w.length - 1);
/** *o: the stem ends consonant–vowel–consonant, the last not w, x or y ("hop", not "snow"). */
const endsCvc = (w: string) => {
  const n = w.length;
  return n >= 3 && isConsonant(w, n - 3) && !isConsonant(w, n - 2) && isConsonant(w, n - 1) && !'wxy'.includes(w[n - 1]);
};

function step1a(w: string): string {
  if (w.endsWith('sses')) return w.slice(0, -2);
  if (w.endsWith('ies')) return w.slice(0, -2);
  if (w.endsWith('ss')) return w;
  if (w.endsWith('s') && !w.endsWith('us') && !w.endsWith('is')) return w.slice(0, -1);
  return w;
}

function step1b(w: string): string {
  if (w.endsWith('eed')) return measure(w.slice(0, -3)) > 0 ? w.slice(0, -1) : w;
  for (const suffix of ['ed', 'ing']) {
    if (!w.endsWith(suffix)) continue;
    const base = w.slice(0, -suffix.length);
    if (!hasVowel(base)) return w;
    if (base.endsWith('at') || base.endsWith('bl') || base.endsWith('iz')) return `${base}e`;
    if (endsDoubleConsonant(base) && !'lsz'.includes(base[base.length - 1])) return base.slice(0, -1);
    if (measure(base) === 1 && endsCvc(base)) return `${base}e`;
    return base;
  }
  return w;
}

function step1c(w: string): string {
  return w.endsWith('y') && hasVowel(w.slice(0, -1)) ? `${w.slice(0, -1)}i` : w;
}

/**
 * Irregular past forms of verbs a bench report uses, read as their base form so "rang" finds
 * "ringing". Only forms that are not also a common noun of the trade: "led" (the diode),
 * "left", "wound" and "lead" stay as written. // common practice, no source (English irregular verbs)
 */
const IRREGULAR = new Map<string, string>(
  Object.entries({
    ring: ['rang', 'rung'],
    fall: ['fell', 'fallen'],
    rise: ['rose', 'risen'],
    run: ['ran'],
    break: ['broke', 'broken'],
    blow: ['blew', 'blown'],
    burn: ['burnt'],
    bend: ['bent'],
    build: ['built'],
    catch: ['caught'],
    draw: ['drew', 'drawn'],
    drive: ['drove', 'driven'],
    feed: ['fed'],
    freeze: ['froze', 'frozen'],
    get: ['got', 'gotten'],
    grow: ['grew', 'grown'],
    hang: ['hung'],
    hold: ['held'],
    keep: ['kept'],
    lose: ['lost'],
    mean: ['meant'],
    send: ['sent'],
    shake: ['shook', 'shaken'],
    sink: ['sank', 'sunk'],
    slide: ['slid'],
    spin: ['spun'],
    stick: ['stuck'],
    swing: ['swung'],
    take: ['took', 'taken'],
    tear: ['tore', 'torn'],
    throw: ['threw', 'thrown'],
    wear: ['wore', 'worn'],
    write: ['wrote', 'written'],
    go: ['went', 'gone'],
    see: ['seen'],
    show: ['shown'],
    give: ['gave', 'given'],
    find: ['found'],
    begin: ['began', 'begun'],
  }).flatMap(([base, forms]) => forms.map((f): [string, string] => [f, base])),
);

/** Marks a written-form term: no typed word starts with it, and it keeps "=rang" apart from the stem "rang" of "range". */
export const WRITTEN_FORM_MARK = '=';

/**
 * The extra index term of an irregular form as written ("rang" → "=rang"), beside its base form:
 * "rang" still finds "ringing" through "ring", and a case that says "rang" as typed counts for
 * more (index the written form and the stem both, then let an exact match add its score).
 * // common practice, no source (search engines keep the written form beside the stem)
 */
export function writtenFormTerm(word: string): string | undefined {
  return IRREGULAR.has(word) ? `${WRITTEN_FORM_MARK}${word}` : undefined;
}

/** Whether an index term is a written-form term (`writtenFormTerm`), not a stem. */
export const isWrittenFormTerm = (term: string): boolean => term.startsWith(WRITTEN_FORM_MARK);

/** The irregular forms that stem to `base` ("ring" → rang, rung): where a highlighter must look besides the stem itself. */
export function irregularFormsOf(base: string): string[] {
  const out: string[] = [];
  for (const [form, b] of IRREGULAR) if (b === base) out.push(form);
  return out;
}
