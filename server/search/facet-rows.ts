/** Ints per row of `FacetRows.meta`: cause code, status code, where the tags start in the pool, how many, engine cause code, author. */
export const FACET_ROW = 6;
export const ROW_CAUSE = 0;
export const ROW_STATUS = 1;
export const ROW_TAGS = 2;
export const ROW_TAG_COUNT = 3;
export const ROW_ENGINE_CAUSE = 4;
export const ROW_AUTHOR = 5;

/** A case's facts as codes (−1 for no cause). */
export interface FacetRow {
  cause: number;
  status: number;
  engineCause: number;
  authorId: number;
  tags: readonly number[];
}

/**
 * Every case's facet codes (cause, status, tags; also its engine cause and author, for the
 * symptom fit and the case policy), packed into two typed arrays: one row of six ints a case
 * and one pool of tag codes. Counting facets visits a thousand candidates or more
 * per search in no useful order; an object and a typed array per case cost a cache miss each,
 * where a row here costs one. Rows and pool space of changed cases are reused or compacted away.
 */
export class FacetRows {
  private readonly rowOfId = new Map<number, number>();
  private readonly freeRows: number[] = [];
  private rows = 0;
  private poolUsed = 0;
  private poolDead = 0;
  /** FACET_ROW ints a row (see ROW_*); read directly by `countFacets`. */
  meta = new Int32Array(FACET_ROW * 1024);
  /** Tag codes, each row's at [meta[ROW_TAGS], + meta[ROW_TAG_COUNT]). */
  pool = new Int32Array(4096);

  /** The row of a case, −1 when it has none. */
  rowOf(id: number): number {
    return this.rowOfId.get(id) ?? -1;
  }

  set(id: number, { cause, status, engineCause, authorId, tags }: FacetRow) {
    this.delete(id);
    const row = this.freeRows.pop() ?? this.rows++;
    if ((row + 1) * FACET_ROW > this.meta.length) this.meta = grown(this.meta, (row + 1) * FACET_ROW);
    if (this.poolUsed + tags.length > this.pool.length) this.pool = grown(this.pool, this.poolUsed + tags.length);
    const at = row * FACET_ROW;
    this.meta[at + ROW_CAUSE] = cause;
    this.meta[at + ROW_STATUS] = status;
    this.meta[at + ROW_TAGS] = this.poolUsed;
    this.meta[at + ROW_TAG_COUNT] = tags.length;
    this.meta[at + ROW_ENGINE_CAUSE] = engineCause;
    this.meta[at + ROW_AUTHOR] = authorId;
    for (const tag of tags) this.pool[this.poolUsed++] = tag;
    this.rowOfId.set(id, row);
  }

  delete(id: number) {
    const row = this.rowOfId.get(id);
    if (row === undefined) return;
    this.rowOfId.delete(id);
    this.freeRows.push(row);
    this.poolDead += this.meta[row * FACET_ROW + ROW_TAG_COUNT];
    if (this.poolDead > 4096 && this.poolDead > this.poolUsed / 2) this.compactPool();
  }

  /** Moves the live rows' tags to the front of a new pool: edits leave their old tags behind. */
  private compactPool() {
    const pool = new Int32Array(Math.max(4096, 2 * (this.poolUsed - this.poolDead)));
    let used = 0;
    for (const row of this.rowOfId.values()) {
      const at = row * FACET_ROW;
      const start = this.meta[at + ROW_TAGS];
      const count = this.meta[at + ROW_TAG_COUNT];
      pool.set(this.pool.subarray(start, start + count), used);
      this.meta[at + ROW_TAGS] = used;
      used += count;
    }
    this.pool = pool;
    this.poolUsed = used;
    this.poolDead = 0;
  }
}

function grown(array: Int32Array<ArrayBuffer>, needed: number): Int32Array<ArrayBuffer> {
  const out = new Int32Array(Math.max(needed, array.length * 2));
  out.set(array);
  return out;
}
