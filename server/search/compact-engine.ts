import SearchableMap from 'minisearch/SearchableMap';
import { indexTerms } from '../../shared/search/text-terms';
import { inverseDocumentFrequency, lengthNorm, saturatedTf } from './bm25f';
import { DOC_FIELDS, FIELD_BOOST, type CaseDoc } from './case-document';

const FIELDS = DOC_FIELDS.length;
const BOOSTS = DOC_FIELDS.map((f) => FIELD_BOOST[f]);

// A posting is one 32-bit word: case slot (24 bits) · field (3 bits) · term frequency (5 bits, capped at 31:
// BM25 saturates long before, so 31 and 40 score within a hair of each other).
const SLOT_SHIFT = 8;
const FIELD_SHIFT = 5;
const TF_MASK = 31;
const MAX_SLOTS = 1 << 24;

/** `slotPostingsEnd`'s second answer: the slot's tf~ (kept outside so the hot loops allocate nothing). */
const slotTf = new Float64Array(1);

/**
 * Walks one slot's postings of a term, which are adjacent, from `i`: returns where the next slot's postings
 * start, and leaves the slot's BM25F tf~ (Σ boost · count · length norm over its fields) in `slotTf[0]`.
 */
function slotPostingsEnd(list: Uint32Array, i: number, n: number, slot: number, norms: Float64Array[]): number {
  let tf = 0;
  for (; i < n && list[i] >>> SLOT_SHIFT === slot; i++) {
    const f = (list[i] >>> FIELD_SHIFT) & 7;
    tf += BOOSTS[f] * (list[i] & TF_MASK) * norms[f][slot];
  }
  slotTf[0] = tf;
  return i;
}


export interface CompactHeader {
  terms: string[];
  slots: number;
  documentCount: number;
  totalLength: number[];
}

/**
 * The inverted index, compact (scored by BM25F, `bm25f.ts`): each term's postings are one growable Uint32Array, cases are
 * numbered slots, field lengths are Uint16Arrays. minisearch keeps a Map per term and field
 * (about 70 bytes a posting, 1.7 GB at 100k cases); this keeps 4 bytes a posting plus slack,
 * and the snapshot is the arrays themselves, so a restart maps them back without parsing.
 * Scoring is BM25F over the fields and their boosts (minisearch's dictionary, a radix tree, is
 * reused for prefix and fuzzy lookups). A changed case takes a new slot; the old one is
 * marked dead and skipped, and `vacuum` drops dead postings once they are a tenth of the lot.
 */
export class CompactEngine {
  /** Term → id, for exact lookups (a hash map: the radix tree is slow to walk for every term of every case). */
  private termIds = new Map<string, number>();
  /** The same, as a radix tree: for prefix and fuzzy lookups. */
  private dict = new SearchableMap<number>();
  private terms: string[] = [];
  private lists: Uint32Array[] = [];
  private used = new Uint32Array(1024);
  private slotOf = new Map<number, number>();
  /** Case id per slot; -1 for a dead slot. */
  private ids = new Int32Array(1024).fill(-1);
  private fieldLength: Uint16Array[] = Array.from({ length: FIELDS }, () => new Uint16Array(1024));
  private totalLength = new Float64Array(FIELDS);
  private slots = 0;
  private dead = 0;
  documentCount = 0;
  /** Bumped by every change: a cached document frequency is good while its stamp equals it. */
  private version = 1;
  private dfCache = new Int32Array(0);
  private dfStamp = new Uint32Array(0);
  /** `scoreTerm`'s per-slot sums, all zero between calls. */
  private scratch = new Float64Array(0);
  /** `scoreAnyOfSlots`' best part per slot, all zero between calls. */
  private anyOfBest = new Float64Array(0);
  /** Per field and slot, BM25F's 1 / (1 − b + b·len/avglen), good while `normsVersion` equals `version`. */
  private norms: Float64Array[] = [];
  private normsVersion = 0;

  has(id: number) {
    return this.slotOf.has(id);
  }

  hasTerm(term: string): boolean {
    const t = this.termIds.get(term);
    return t !== undefined && this.used[t] > 0;
  }

  /** Postings of a term over all fields (dead ones included until vacuumed): its cost to score. */
  postings(term: string): number {
    const t = this.termIds.get(term);
    return t === undefined ? 0 : this.used[t];
  }

  /** Live cases holding the term; above `cap` the exact count is not needed and the postings are returned. */
  documentFrequency(term: string, cap: number): number {
    const t = this.termIds.get(term);
    if (t === undefined) return 0;
    const n = this.used[t];
    if (n > FIELDS * cap + this.dead) return n;
    const list = this.lists[t];
    let count = 0;
    let last = -1;
    // a case's postings of one term are adjacent: count the changes of slot
    for (let i = 0; i < n; i++) {
      const slot = list[i] >>> SLOT_SHIFT;
      if (slot !== last && this.ids[slot] >= 0) count++;
      last = slot;
    }
    return count;
  }

  /** Live cases holding the term in any of `fields` (field numbers in DOC_FIELDS' order). */
  casesWithTerm(term: string, fields: number[]): number[] {
    const t = this.termIds.get(term);
    if (t === undefined) return [];
    const list = this.lists[t];
    const out: number[] = [];
    let last = -1;
    for (let i = 0; i < this.used[t]; i++) {
      const slot = list[i] >>> SLOT_SHIFT;
      const id = this.ids[slot];
      if (slot === last || id < 0 || !fields.includes((list[i] >>> FIELD_SHIFT) & 7)) continue;
      last = slot;
      out.push(id);
    }
    return out;
  }

  completions(prefix: string, limit: number): { term: string; postings: number }[] {
    const out: { term: string; postings: number }[] = [];
    for (const [term, t] of this.dict.atPrefix(prefix)) if (term !== prefix && this.used[t] > 0) out.push({ term, postings: this.used[t] });
    return out.length > limit ? out.sort((a, b) => b.postings - a.postings).slice(0, limit) : out;
  }

  nearTerms(term: string, distance: number): { term: string; distance: number }[] {
    const out: { term: string; distance: number }[] = [];
    for (const [t, [v, d]] of this.dict.fuzzyGet(term, distance)) if (d > 0 && this.used[v] > 0) out.push({ term: t, distance: d });
    return out;
  }

  addAll(docs: CaseDoc[]) {
    for (const d of docs) this.add(d);
  }

  add(doc: CaseDoc) {
    if (this.slotOf.has(doc.id)) this.discard(doc.id);
    if (this.slots >= MAX_SLOTS) this.vacuum(true);
    const slot = this.slots++;
    this.version++;
    this.grow(slot + 1);
    this.ids[slot] = doc.id;
    this.slotOf.set(doc.id, slot);
    this.documentCount++;
    // per term, its count in each field, 6 bits a field (capped at 31 below, so no field overflows into the next)
    const freqs = new Map<string, number>();
    DOC_FIELDS.forEach((field, f) => {
      const terms = indexTerms(doc[field]);
      const shift = 6 * f;
      for (const term of terms) {
        const packed = freqs.get(term) ?? 0;
        const n = (packed >>> shift) & 63;
        if (n < TF_MASK) freqs.set(term, packed + (1 << shift));
      }
      // the field's length in index terms (stop words left out), for BM25F's length normalisation
      const length = Math.min(terms.length, 65535);
      this.fieldLength[f][slot] = length;
      this.totalLength[f] += length;
    });
    for (const [term, packed] of freqs) {
      let t = this.termIds.get(term);
      if (t === undefined) {
        t = this.terms.length;
        this.terms.push(term);
        this.termIds.set(term, t);
        this.dict.set(term, t);
        this.lists.push(new Uint32Array(2));
        if (t >= this.used.length) this.used = copyInto(new Uint32Array(this.used.length * 2), this.used);
      }
      for (let f = 0; f < FIELDS; f++) {
        const tf = (packed >>> (6 * f)) & 63;
        if (tf > 0) this.push(t, (slot << SLOT_SHIFT) | (f << FIELD_SHIFT) | tf);
      }
    }
  }

  discard(id: number) {
    const slot = this.slotOf.get(id);
    if (slot === undefined) return;
    this.slotOf.delete(id);
    this.version++;
    this.ids[slot] = -1;
    for (let f = 0; f < FIELDS; f++) this.totalLength[f] -= this.fieldLength[f][slot];
    this.documentCount--;
    this.dead++;
    if (this.dead > 1000 && this.dead > 0.1 * this.documentCount) this.vacuum(false);
  }

  /**
   * Adds weight × BM25F (see the top of this file) to `out` for each live case `allow` admits:
   * `scoreTermSlots` into a scratch array, then moved to the map by case id.
   */
  scoreTerm(term: string, weight: number, allow: (id: number) => boolean, out: Map<number, number>) {
    this.scoreIntoMap((admit, acc, touched) => this.scoreTermSlots(term, weight, admit, acc, touched), allow, out);
  }

  /** `scoreAnyOfSlots`, added to `out` by case id as `scoreTerm` does. */
  scoreAnyOf(terms: readonly { term: string; weight: number }[], allow: (id: number) => boolean, out: Map<number, number>) {
    this.scoreIntoMap((admit, acc, touched) => this.scoreAnyOfSlots(terms, admit, acc, touched), allow, out);
  }

  private scoreIntoMap(score: (admit: (slot: number) => boolean, acc: Float64Array, touched: number[]) => void, allow: (id: number) => boolean, out: Map<number, number>) {
    if (this.scratch.length < this.slots) this.scratch = new Float64Array(Math.max(this.slots, 2 * this.scratch.length));
    const acc = this.scratch;
    const touched: number[] = [];
    score((slot) => allow(this.ids[slot]), acc, touched);
    for (const slot of touched) {
      const id = this.ids[slot];
      out.set(id, (out.get(id) ?? 0) + acc[slot]);
      acc[slot] = 0;
    }
  }

  /** Slots in use (live and dead): the size of a per-slot array. */
  get slotCount(): number {
    return this.slots;
  }

  /** The case in a slot, −1 when the slot is dead. */
  idAt(slot: number): number {
    return this.ids[slot];
  }

  /**
   * `scoreTerm` over slots instead of case ids, for the hot path of a query: adds weight × BM25F
   * into `acc[slot]` for each live slot `admit` returns true for, and appends each slot seen for
   * the first time (its `acc` still 0; scores are always positive) to `touched`. No maps: a
   * common word's thousands of postings cost an array add each.
   */
  scoreTermSlots(term: string, weight: number, admit: (slot: number) => boolean, acc: Float64Array, touched: number[]) {
    const t = this.termIds.get(term);
    if (t === undefined || this.documentCount === 0) return;
    const list = this.lists[t];
    const n = this.used[t];
    const ids = this.ids;
    const df = this.liveCases(t);
    if (df === 0) return;
    const idf = weight * inverseDocumentFrequency(this.documentCount, df);
    const norms = this.lengthNorms();
    for (let i = 0; i < n; ) {
      const slot = list[i] >>> SLOT_SHIFT;
      i = slotPostingsEnd(list, i, n, slot, norms);
      if (ids[slot] < 0 || !admit(slot)) continue;
      const tf = slotTf[0];
      const score = idf * saturatedTf(tf);
      if (acc[slot] === 0) touched.push(slot);
      acc[slot] += score;
    }
  }

  /**
   * A word still being typed, scored as the one word it will be: `terms` are its completions (and
   * the stems it may be heading for), each with its weight. Per case, the best of weight × (δ +
   * tf~·(k1 + 1)/(tf~ + k1)) over the completions it holds, times one idf worked out from the
   * cases holding any of them. Summing each completion's own BM25F let the rarest completion
   * decide: for "ground lea", the one case that says "leaves" (a rare word: a large idf) came
   * before every case with "lead", the word being typed. With one term this is `scoreTermSlots`
   * exactly. `acc` and `touched` as there.
   */
  scoreAnyOfSlots(terms: readonly { term: string; weight: number }[], admit: (slot: number) => boolean, acc: Float64Array, touched: number[]) {
    if (this.documentCount === 0) return;
    if (this.anyOfBest.length < this.slots) this.anyOfBest = new Float64Array(Math.max(this.slots, 2 * this.anyOfBest.length));
    const best = this.anyOfBest;
    const holding: number[] = [];
    const ids = this.ids;
    const norms = this.lengthNorms();
    for (const { term, weight } of terms) {
      const t = this.termIds.get(term);
      if (t === undefined) continue;
      const list = this.lists[t];
      const n = this.used[t];
      for (let i = 0; i < n; ) {
        const slot = list[i] >>> SLOT_SHIFT;
        i = slotPostingsEnd(list, i, n, slot, norms);
        if (ids[slot] < 0) continue;
        const tf = slotTf[0];
        const part = weight * saturatedTf(tf);
        if (best[slot] === 0) holding.push(slot);
        if (part > best[slot]) best[slot] = part;
      }
    }
    // the document frequency of the word as typed: live cases holding any completion, visible or not (as for one term)
    const idf = inverseDocumentFrequency(this.documentCount, holding.length);
    for (const slot of holding) {
      const part = best[slot];
      best[slot] = 0;
      if (!admit(slot)) continue;
      if (acc[slot] === 0) touched.push(slot);
      acc[slot] += idf * part;
    }
  }

  /**
   * BM25F's length normalisation of every field of every slot, worked out once per change to the
   * index rather than divided out again for each posting of each query term.
   */
  private lengthNorms(): Float64Array[] {
    if (this.normsVersion === this.version) return this.norms;
    for (let f = 0; f < FIELDS; f++) {
      let out = this.norms[f];
      if (!out || out.length < this.slots) out = this.norms[f] = new Float64Array(Math.max(1024, this.slots * 2));
      const avg = this.totalLength[f] / this.documentCount || 1;
      const lengths = this.fieldLength[f];
      for (let slot = 0; slot < this.slots; slot++) out[slot] = lengthNorm(lengths[slot], avg);
    }
    this.normsVersion = this.version;
    return this.norms;
  }

  /** Live cases holding term `t`, counted once per change to the index. */
  private liveCases(t: number): number {
    if (this.dfCache.length <= t) {
      const size = Math.max(1024, this.terms.length * 2);
      this.dfCache = copyInto(new Int32Array(size), this.dfCache);
      this.dfStamp = copyInto(new Uint32Array(size), this.dfStamp);
    }
    if (this.dfStamp[t] === this.version) return this.dfCache[t];
    const list = this.lists[t];
    const n = this.used[t];
    let df = 0;
    for (let i = 0, last = -1; i < n; i++) {
      const slot = list[i] >>> SLOT_SHIFT;
      if (slot !== last && this.ids[slot] >= 0) df++;
      last = slot;
    }
    this.dfCache[t] = df;
    this.dfStamp[t] = this.version;
    return df;
  }

  /** Drops dead postings; with `renumber`, also gives the live cases slots from 0 again. */
  vacuum(renumber: boolean) {
    this.version++;
    const map = new Int32Array(this.slots).fill(-1);
    let next = 0;
    for (let s = 0; s < this.slots; s++) if (this.ids[s] >= 0) map[s] = renumber ? next++ : s;
    for (let t = 0; t < this.lists.length; t++) {
      const list = this.lists[t];
      let w = 0;
      for (let i = 0; i < this.used[t]; i++) {
        const to = map[list[i] >>> SLOT_SHIFT];
        if (to >= 0) list[w++] = (to << SLOT_SHIFT) | (list[i] & 0xff);
      }
      this.used[t] = w;
    }
    if (renumber) {
      const ids = new Int32Array(this.ids.length).fill(-1);
      const lengths = this.fieldLength.map((l) => new Uint16Array(l.length));
      for (let s = 0; s < this.slots; s++) {
        const to = map[s];
        if (to < 0) continue;
        ids[to] = this.ids[s];
        for (let f = 0; f < FIELDS; f++) lengths[f][to] = this.fieldLength[f][s];
        this.slotOf.set(this.ids[s], to);
      }
      this.ids = ids;
      this.fieldLength = lengths;
      this.slots = next;
    }
    this.dead = 0;
  }

  /** A JSON header and one buffer: ids, field lengths, list lengths, then every list. */
  encode(): { header: CompactHeader; body: Buffer } {
    const s = this.slots;
    const parts: Uint8Array[] = [];
    const view = (a: Int32Array | Uint32Array | Uint16Array) => new Uint8Array(a.buffer, a.byteOffset, a.byteLength);
    parts.push(view(this.ids.subarray(0, s)));
    for (let f = 0; f < FIELDS; f++) {
      // pad the Uint16 runs to 4 bytes so the Uint32 sections stay aligned
      const padded = new Uint16Array(s + (s & 1));
      padded.set(this.fieldLength[f].subarray(0, s));
      parts.push(view(padded));
    }
    parts.push(view(this.used.subarray(0, this.terms.length)));
    for (let t = 0; t < this.terms.length; t++) parts.push(view(this.lists[t].subarray(0, this.used[t])));
    return { header: { terms: this.terms, slots: s, documentCount: this.documentCount, totalLength: [...this.totalLength] }, body: Buffer.concat(parts) };
  }

  /** Restores `encode()`d arrays; the lists are views into `body` until a case is added to them. */
  static decode(header: CompactHeader, body: Buffer): CompactEngine {
    const e = new CompactEngine();
    const s = header.slots;
    if (body.byteOffset % 4 !== 0) body = Buffer.from(body);
    let at = body.byteOffset;
    const take32 = (n: number) => {
      const a = new Uint32Array(body.buffer, at, n);
      at += n * 4;
      return a;
    };
    e.slots = s;
    e.ids = new Int32Array(Math.max(1024, s));
    e.ids.fill(-1);
    e.ids.set(new Int32Array(body.buffer, at, s));
    at += s * 4;
    for (let f = 0; f < FIELDS; f++) {
      e.fieldLength[f] = new Uint16Array(Math.max(1024, s));
      e.fieldLength[f].set(new Uint16Array(body.buffer, at, s));
      at += (s + (s & 1)) * 2;
    }
    e.terms = header.terms;
    e.used = new Uint32Array(Math.max(1024, e.terms.length));
    e.used.set(take32(e.terms.length));
    e.lists = e.terms.map((term, t) => {
      e.termIds.set(term, t);
      e.dict.set(term, t);
      return take32(e.used[t]);
    });
    for (let slot = 0; slot < s; slot++) if (e.ids[slot] >= 0) e.slotOf.set(e.ids[slot], slot);
    e.dead = s - e.slotOf.size;
    e.documentCount = header.documentCount;
    e.totalLength = Float64Array.from(header.totalLength);
    return e;
  }

  private push(t: number, entry: number) {
    let list = this.lists[t];
    const n = this.used[t];
    if (n === list.length) this.lists[t] = list = copyInto(new Uint32Array(Math.max(4, Math.ceil(n * 1.5))), list);
    list[n] = entry;
    this.used[t] = n + 1;
  }

  private grow(slots: number) {
    if (slots <= this.ids.length) return;
    const size = Math.max(slots, this.ids.length * 2);
    const ids = new Int32Array(size).fill(-1);
    ids.set(this.ids);
    this.ids = ids;
    this.fieldLength = this.fieldLength.map((l) => copyInto(new Uint16Array(size), l));
  }
}

/** `to` holding `from` at its start: a typed array grown by copying. */
function copyInto<T extends Uint32Array | Uint16Array | Int32Array>(to: T, from: T): T {
  to.set(from);
  return to;
}
