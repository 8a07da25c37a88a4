import type { Actor } from '../../shared/auth/roles';
import type { HighlightField, SearchQuery, SearchResponse, SimilarResponse } from '../../shared/schemas/search';
import type { Db } from '../db/database';
import { searchPageRows, searchSourceRows, searchSourceStamp, searchTags, synonymsByTag, type SearchPageRow } from '../db/repositories/search-source';
import { AppError } from '../errors';
import { synonymMap } from '../services/tags';
import { caseDocument } from './case-document';
import type { CaseIndex, IndexTuning } from './case-index';
import { latestChangeId, recordCaseChange } from './change-log';
import { ChangeFollower } from './change-follower';
import { localCore, workerCore, type CoreClient } from './core-client';
import type { TextFilterFields } from './list-filter';
import type { Ranked } from './rank';
import type { SynonymStats } from './search-core';

export interface CaseSearchOptions {
  /** Where the snapshot lives; without it the index is rebuilt on every start. */
  dataDir?: string;
  tuning?: IndexTuning;
  /** Quiet time after the last change before the snapshot is written. */
  snapshotDelayMs?: number;
  /** Hold the index on a worker thread (the server); in process otherwise (tests, tools). */
  worker?: boolean;
  /** Return at once and load in the background (the server listens meanwhile); else wait until ready. */
  background?: boolean;
  /** How often the change log is read for other instances' writes; 0 turns following off. */
  followMs?: number;
  /** How long a search made before the index is ready waits for it before answering 503. */
  readyWaitMs?: number;
}

/** The search index as the app uses it: kept in step with case writes here and on other instances, snapshotted to DATA_DIR. */
export interface CaseSearch {
  /** The index itself, when it is held in process (tests). */
  readonly index: CaseIndex;
  /** How this index came to be, for logs and tests; `loading` until ready. */
  readonly origin: 'snapshot' | 'rebuilt' | 'loading';
  /** Whether searches are answered yet (GET /api/ready). */
  isReady(): boolean;
  /** How far behind the other instances' writes this index may be, in seconds (the index lag metric); undefined while loading. */
  lagSeconds(): number | undefined;
  /** Resolves once the index is loaded; rejects when loading failed. */
  readonly ready: Promise<void>;
  /** Cases indexed. */
  size(): Promise<number>;
  /** Logs a change to one case for every instance and indexes it here as it now is (removes it when it is gone). */
  syncCase(id: number): Promise<void>;
  removeCase(id: number): Promise<void>;
  /** Reads every case again, here and (through the log) on every instance: after tag curation or an import. */
  rebuild(): Promise<void>;
  /** Applies the other instances' changes now instead of at the next poll (tests). */
  followNow(): Promise<void>;
  /** Stops the worker thread as a crash would (tests of the restart); nothing in process. */
  killWorker(): Promise<void>;
  search(actor: Actor, query: SearchQuery): Promise<SearchResponse>;
  similar(actor: Actor, id: number): Promise<SimilarResponse>;
  /** Ids whose title or summary (or, for 'lessons', title or lesson) may hold `q` as whole words, at most `limit`; undefined until ready or when the index cannot say. */
  listCandidates(q: string, limit: number, fields?: TextFilterFields): Promise<number[] | undefined>;
  saveSnapshot(): Promise<void>;
  close(): Promise<void>;
}

/** Cases read from the database per batch while building: bounded memory, and the event loop breathes between batches. */
const BUILD_BATCH = 2000;

const synonymStats = (byTag: Map<string, string[]>): SynonymStats => {
  const all = [...byTag.values()].flat();
  return { count: all.length, length: all.reduce((n, s) => n + s.length, 0) };
};

const round = (x: number) => Math.round(x * 1e4) / 1e4;

function bodyFields(r: SearchPageRow): { field: HighlightField; text: string | null }[] {
  return [
    { field: 'title', text: r.title },
    { field: 'summary', text: r.summary },
    { field: 'narrative', text: r.narrative },
    { field: 'fix', text: r.fix },
    { field: 'lesson', text: [r.lesson_summary, r.lesson_detail].filter(Boolean).join('\n') },
  ];
}

/** Every case into `core`, a batch at a time, by id. */
async function buildInto(db: Db, core: CoreClient) {
  const synonyms = await synonymsByTag(db);
  await core.begin();
  let after = 0;
  for (;;) {
    const ids = (await db.selectFrom('cases').select('id').where('id', '>', after).orderBy('id').limit(BUILD_BATCH).execute()).map((r) => r.id);
    if (ids.length === 0) break;
    const [rows, tags] = await Promise.all([searchSourceRows(db, ids), searchTags(db, ids)]);
    await core.add(rows.map((r) => caseDocument(r, tags.get(r.id) ?? [], synonyms)));
    after = ids[ids.length - 1];
  }
  await core.finish(synonymStats(synonyms));
}

/**
 * Opens the index: from the snapshot when it matches the database, else built from the cases
 * (and snapshotted). With `background`, returns at once; searches wait up to `readyWaitMs`
 * for the index, then answer 503.
 */
export async function openCaseSearch(db: Db, options: CaseSearchOptions = {}): Promise<CaseSearch> {
  const { dataDir, tuning, snapshotDelayMs, worker = false, background = false, followMs = 500, readyWaitMs = 5000 } = options;
  let failure: Error | undefined;
  let ready = false;
  let origin: CaseSearch['origin'] = 'loading';
  /** Changes this instance logged and already applied: the follower skips them. */
  const applied = new Set<number>();
  let closed = false;
  /** Worker restarts in a row without a load that finished, for the back-off. */
  let restarts = 0;

  const openCore = (): CoreClient =>
    worker
      ? workerCore({ dataDir, tuning, snapshotDelayMs }, (err) => {
          ready = false;
          if (closed) return;
          void follower.stop();
          // a worker that dies (out of memory, a crash) is started again and reloads from the snapshot;
          // one that keeps dying is retried ever more slowly, and searches answer 503 meanwhile
          const delayMs = Math.min(60_000, 500 * 2 ** Math.min(restarts++, 7));
          console.error(`[falsetrace] search worker failed (${err.message}); starting a new one in ${delayMs} ms`);
          setTimeout(() => void restart(), delayMs).unref();
        })
      : localCore({ dataDir, tuning, snapshotDelayMs });
  let core = openCore();

  async function syncOne(id: number) {
    const [rows, tags, bySynonym] = await Promise.all([searchSourceRows(db, [id]), searchTags(db, [id]), synonymsByTag(db)]);
    if (rows.length === 0) await core.remove(id);
    else await core.upsert(caseDocument(rows[0], tags.get(id) ?? [], bySynonym));
  }

  const newFollower = () =>
    new ChangeFollower(db, {
      applied,
      syncCase: syncOne,
      rebuild: () => buildInto(db, core),
    });
  let follower = newFollower();

  const startLoad = () =>
    (async () => {
      // read before anything else: a change made while the index loads is then applied after it
      const from = await latestChangeId(db);
      const [stamp, synonyms] = await Promise.all([searchSourceStamp(db), synonymsByTag(db)]);
      if (await core.restore(stamp, synonymStats(synonyms))) origin = 'snapshot';
      else {
        await buildInto(db, core);
        origin = 'rebuilt';
      }
      if (closed) return;
      follower.start(from, followMs);
      failure = undefined;
      restarts = 0;
      ready = true;
    })();
  let load = startLoad();
  load.catch((err) => {
    failure = err as Error;
    console.error('[falsetrace] search index failed to load:', err);
  });

  /** A new worker after the old one died: the index reloaded as at start-up, the change log followed from there. */
  async function restart() {
    if (closed) return;
    await follower.stop();
    await core.terminate().catch(() => undefined);
    applied.clear();
    follower = newFollower();
    core = openCore();
    load = startLoad();
    await load.catch((err) => {
      failure = err as Error;
      console.error('[falsetrace] search index failed to load after a restart:', err);
    });
  }

  async function whenReady() {
    if (ready) return;
    if (failure) throw new AppError('unavailable', 'Search is unavailable: its index failed to load. The server log says why.');
    let timer: NodeJS.Timeout | undefined;
    const waited = await Promise.race([
      load.then(() => true, () => false),
      new Promise<boolean>((resolve) => (timer = setTimeout(() => resolve(false), readyWaitMs))),
    ]);
    clearTimeout(timer);
    if (!waited || !ready) throw new AppError('unavailable', 'Search is still loading its index; try again in a few seconds.');
  }

  async function page(ranked: Ranked[]) {
    const rows = new Map((await searchPageRows(db, ranked.map((r) => r.id))).map((r) => [r.id, r]));
    return ranked.filter((r) => rows.has(r.id)).map((r) => ({ ranked: r, row: rows.get(r.id)! }));
  }

  async function logged(caseId: number | null, apply: () => Promise<void>) {
    const change = await recordCaseChange(db, caseId);
    // before the index is ready the follower applies it, after the load
    if (!ready) return;
    applied.add(change);
    await apply();
  }

  if (!background) await load;

  return {
    get index() {
      if (!core.local) throw new Error('the search index lives on its worker thread');
      return core.local.current;
    },
    get origin() {
      return origin;
    },
    get ready() {
      return load;
    },
    isReady: () => ready && !failure,
    lagSeconds: () => (ready ? follower.lagSeconds() : undefined),
    size: () => core.size(),
    killWorker: async () => core.kill?.(),
    syncCase: (id) => logged(id, () => syncOne(id)),
    removeCase: (id) => logged(id, () => core.remove(id)),
    rebuild: () => logged(null, () => buildInto(db, core)),
    followNow: () => follower.poll(),
    async search(actor, query) {
      await whenReady();
      const ranked = await core.rank(actor, query, [...(await synonymMap(db))]);
      const rows = await page(ranked.page);
      const highlights = await core.highlights(rows.map(({ row }) => bodyFields(row)), ranked.terms);
      return {
        results: rows.map(({ ranked: r, row }, i) => ({
          id: row.id,
          title: row.title,
          summary: row.summary,
          cause: row.cause,
          score: round(r.score),
          highlights: highlights[i],
        })),
        facets: ranked.facets,
        total: ranked.total,
        reading: ranked.reading && { text: ranked.reading.text, observations: ranked.reading.observations, causes: ranked.reading.causes.map((c) => ({ cause: c.cause, likelihood: round(c.likelihood) })) },
      };
    },
    async similar(actor, id) {
      await whenReady();
      const [source] = await searchSourceRows(db, [id]);
      if (!source) return { similar: [] };
      const rows = await page(await core.similar(actor, { id: source.id, title: source.title, summary: source.summary }));
      return { similar: rows.map(({ ranked: r, row }) => ({ id: row.id, title: row.title, summary: row.summary, cause: row.cause, score: round(r.score) })) };
    },
    listCandidates: async (q, limit, fields) => (ready && !failure ? core.listCandidates(q, limit, fields) : undefined),
    saveSnapshot: () => core.save(),
    async close() {
      closed = true;
      await follower.stop();
      // a worker is stopped mid-load; in process the load cannot be interrupted
      if (!worker) await load.catch(() => undefined);
      await core.terminate();
    },
  };
}
