import type { Actor } from '../../shared/auth/roles';
import type { HighlightField, SearchHighlight, SearchQuery } from '../../shared/schemas/search';
import type { CaseDoc, CaseFacts } from './case-document';
import { CaseIndex, type IndexTuning } from './case-index';
import type { Facets } from './facets';
import { highlightsFor } from './highlight';
import { listTextCandidates, type TextFilterFields } from './list-filter';
import { rankCases, visibilityOf, type Ranked } from './rank';
import { similarCases, type SimilarSource } from './similar';
import { indexStamp, readSnapshot, writeSnapshot } from './snapshot';
import type { SymptomReading } from '../../shared/search/symptom-query';

export interface CoreOptions {
  /** Where the snapshot lives; without it the index is rebuilt on every start. */
  dataDir?: string;
  tuning?: IndexTuning;
  /** Quiet time after the last change before the snapshot is written. */
  snapshotDelayMs?: number;
}

export interface IndexEntry {
  doc: CaseDoc;
  facts: CaseFacts;
}

export interface SynonymStats {
  count: number;
  length: number;
}

/** A ranked page as it crosses to the request thread: plain data only. */
export interface CorePage {
  page: Ranked[];
  total: number;
  facets: Facets;
  reading: Pick<SymptomReading, 'text' | 'observations' | 'causes'> | null;
  terms: string[];
}

export type HighlightSource = { field: HighlightField; text: string | null }[];

/**
 * The search index and everything computed from it, with no database: it runs on a worker
 * thread in the server (so scoring never blocks requests) or in process in tests. The owner
 * reads cases from the database and hands them over as documents.
 */
export class SearchCore {
  private index: CaseIndex | undefined;
  private building: CaseIndex | undefined;
  private synonyms: SynonymStats = { count: 0, length: 0 };
  private dirty = false;
  private timer: NodeJS.Timeout | undefined;

  constructor(private readonly options: CoreOptions = {}) {}

  /** The live index (in-process use and tests only). */
  get current(): CaseIndex {
    if (!this.index) throw new Error('the search index is not loaded yet');
    return this.index;
  }

  size(): number {
    return this.index?.size ?? 0;
  }

  /** Loads the snapshot when it exists and matches `stamp`; false when it must be built. */
  restore(stamp: string, synonyms: SynonymStats): boolean {
    const { dataDir, tuning } = this.options;
    const index = dataDir ? readSnapshot(dataDir, stamp, tuning) : undefined;
    if (!index) return false;
    this.index = index;
    this.synonyms = synonyms;
    return true;
  }

  /** Starts a new index; the current one keeps answering until `finish`. */
  begin() {
    this.building = new CaseIndex();
  }

  add(entries: IndexEntry[]) {
    const b = this.building!;
    b.engine.addAll(entries.map((e) => e.doc));
    for (const e of entries) b.setFacts(e.doc.id, e.facts);
  }

  /** Swaps the new index in and snapshots it. */
  finish(synonyms: SynonymStats) {
    const b = this.building!;
    this.building = undefined;
    this.index = b;
    this.synonyms = synonyms;
    this.dirty = true;
    this.save();
  }

  upsert(entry: IndexEntry) {
    this.index?.upsert(entry.doc, entry.facts);
    // a build in progress may have read this case before it changed
    if (this.building?.facts.has(entry.doc.id)) this.building.upsert(entry.doc, entry.facts);
    this.changed();
  }

  remove(id: number) {
    this.index?.remove(id);
    this.building?.remove(id);
    this.changed();
  }

  rank(actor: Actor, query: SearchQuery, synonyms: [string, string][]): CorePage {
    const r = rankCases(this.current, actor, query, new Map(synonyms));
    return {
      page: r.page,
      total: r.total,
      facets: r.facets,
      reading: r.reading && { text: r.reading.text, observations: r.reading.observations, causes: r.reading.causes },
      terms: [...r.terms],
    };
  }

  /** Highlights of the shown page only: a result's text is tokenised when it is on screen, never before. */
  highlights(pages: HighlightSource[], terms: string[]): SearchHighlight[][] {
    const set = new Set(terms);
    return pages.map((fields) => highlightsFor(fields, set));
  }

  similar(actor: Actor, source: SimilarSource): Ranked[] {
    return similarCases(this.current, source, visibilityOf(this.current, actor));
  }

  /** The case list's text filter narrowed by the index (see list-filter.ts); undefined while loading or when it cannot say. */
  listCandidates(q: string, limit: number, fields: TextFilterFields = 'list'): number[] | undefined {
    return this.index ? listTextCandidates(this.index, q, limit, fields) : undefined;
  }

  /** Writes the snapshot now if anything changed since the last one. */
  save() {
    const { dataDir } = this.options;
    if (!dataDir || !this.dirty || !this.index) return;
    writeSnapshot(dataDir, this.index, indexStamp(this.index, this.synonyms));
    this.dirty = false;
  }

  close() {
    clearTimeout(this.timer);
    this.save();
  }

  private changed() {
    this.dirty = true;
    if (!this.options.dataDir) return;
    clearTimeout(this.timer);
    this.timer = setTimeout(() => {
      try {
        this.save();
      } catch (err) {
        console.error('[falsetrace] search snapshot failed:', err);
      }
    }, this.options.snapshotDelayMs ?? 10_000);
    this.timer.unref();
  }
}
