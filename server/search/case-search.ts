import type { Actor } from '../../shared/auth/roles';
import type { HighlightField, SearchQuery, SearchResponse, SimilarResponse } from '../../shared/schemas/search';
import type { Db } from '../db/database';
import { searchSourceRows, searchSourceStamp, searchTags, synonymsByTag, type SearchSourceRow } from '../db/repositories/search-source';
import { synonymMap } from '../services/tags';
import { caseDocument } from './case-document';
import { CaseIndex, type IndexTuning } from './case-index';
import { highlightsFor } from './highlight';
import { rankCases, visibilityOf, type Ranked } from './rank';
import { similarCases } from './similar';
import { indexStamp, readSnapshot, writeSnapshot } from './snapshot';

export interface CaseSearchOptions {
  /** Where the snapshot lives; without it the index is rebuilt on every start. */
  dataDir?: string;
  tuning?: IndexTuning;
  /** Quiet time after the last change before the snapshot is written. */
  snapshotDelayMs?: number;
}

/** The search index as the app uses it: kept in step with case writes, snapshotted to DATA_DIR. */
export interface CaseSearch {
  readonly index: CaseIndex;
  /** How this index came to be, for logs and tests. */
  readonly origin: 'snapshot' | 'rebuilt';
  /** Re-reads one case and indexes it as it now is (removes it when it is gone). */
  syncCase(id: number): Promise<void>;
  removeCase(id: number): void;
  /** Reads every case again: after tag curation (rename, merge) that touches many cases. */
  rebuild(): Promise<void>;
  search(actor: Actor, query: SearchQuery): Promise<SearchResponse>;
  similar(actor: Actor, id: number): Promise<SimilarResponse>;
  saveSnapshot(): void;
  close(): void;
}

const synonymStats = (byTag: Map<string, string[]>) => {
  const all = [...byTag.values()].flat();
  return { count: all.length, length: all.reduce((n, s) => n + s.length, 0) };
};

async function buildIndex(db: Db, tuning?: IndexTuning) {
  const [rows, tags, synonyms] = await Promise.all([searchSourceRows(db), searchTags(db), synonymsByTag(db)]);
  const index = new CaseIndex(undefined, undefined, tuning);
  index.addAll(rows.map((r) => caseDocument(r, tags.get(r.id) ?? [], synonyms)));
  return { index, synonyms: synonymStats(synonyms) };
}

const round = (x: number) => Math.round(x * 1e4) / 1e4;

function bodyFields(r: SearchSourceRow): { field: HighlightField; text: string | null }[] {
  return [
    { field: 'title', text: r.title },
    { field: 'summary', text: r.summary },
    { field: 'narrative', text: r.narrative },
    { field: 'fix', text: r.fix },
    { field: 'lesson', text: [r.lesson_summary, r.lesson_detail].filter(Boolean).join('\n') },
  ];
}

/** Opens the index from the snapshot when it matches the database, else rebuilds it (and snapshots it). */
export async function openCaseSearch(db: Db, options: CaseSearchOptions = {}): Promise<CaseSearch> {
  const { dataDir, tuning, snapshotDelayMs = 10_000 } = options;
  const stamp = await searchSourceStamp(db);
  let index = dataDir ? readSnapshot(dataDir, stamp, tuning) : undefined;
  let synonyms = synonymStats(await synonymsByTag(db));
  const origin = index ? 'snapshot' : 'rebuilt';
  if (!index) ({ index, synonyms } = await buildIndex(db, tuning));

  let timer: NodeJS.Timeout | undefined;
  let pending = 0;
  let dirty = origin === 'rebuilt';
  const save = () => {
    if (!dataDir || !dirty) return;
    // a case being re-read would be missing from a snapshot written now
    if (pending > 0) return schedule();
    // writes shift every score a little; once they add up, score the common terms afresh
    if (index!.heavy.drifted(index!.size)) index!.rebuildHeavy();
    writeSnapshot(dataDir, index!, indexStamp(index!, synonyms));
    dirty = false;
  };
  const schedule = () => {
    if (!dataDir) return;
    clearTimeout(timer);
    timer = setTimeout(() => {
      try {
        save();
      } catch (err) {
        console.error('[falsetrace] search snapshot failed:', err);
      }
    }, snapshotDelayMs);
    timer.unref();
  };
  const changed = () => {
    dirty = true;
    schedule();
  };
  if (dirty) save();

  async function page(ranked: Ranked[]) {
    const rows = new Map((await searchSourceRows(db, ranked.map((r) => r.id))).map((r) => [r.id, r]));
    return ranked.filter((r) => rows.has(r.id)).map((r) => ({ ranked: r, row: rows.get(r.id)! }));
  }

  return {
    get index() {
      return index!;
    },
    origin,
    async syncCase(id) {
      pending++;
      try {
        const [rows, tags, bySynonym] = await Promise.all([searchSourceRows(db, [id]), searchTags(db, [id]), synonymsByTag(db)]);
        if (rows.length === 0) index!.remove(id);
        else {
          const { doc, facts } = caseDocument(rows[0], tags.get(id) ?? [], bySynonym);
          index!.upsert(doc, facts);
        }
      } finally {
        pending--;
      }
      changed();
    },
    removeCase(id) {
      index!.remove(id);
      changed();
    },
    async rebuild() {
      ({ index, synonyms } = await buildIndex(db, tuning));
      dirty = true;
      schedule();
    },
    async search(actor, query) {
      const ranked = rankCases(index!, actor, query, await synonymMap(db));
      const rows = await page(ranked.page);
      return {
        results: rows.map(({ ranked: r, row }) => ({
          id: row.id,
          title: row.title,
          summary: row.summary,
          cause: row.cause,
          score: round(r.score),
          highlights: highlightsFor(bodyFields(row), ranked.terms),
        })),
        facets: ranked.facets,
        total: ranked.total,
        reading: ranked.reading && { text: ranked.reading.text, observations: ranked.reading.observations, causes: ranked.reading.causes.map((c) => ({ cause: c.cause, likelihood: round(c.likelihood) })) },
      };
    },
    async similar(actor, id) {
      const [source] = await searchSourceRows(db, [id]);
      if (!source) return { similar: [] };
      const rows = await page(similarCases(index!, source, visibilityOf(index!, actor)));
      return { similar: rows.map(({ ranked: r, row }) => ({ id: row.id, title: row.title, summary: row.summary, cause: row.cause, score: round(r.score) })) };
    },
    saveSnapshot: save,
    close() {
      clearTimeout(timer);
      save();
    },
  };
}
