import type { Db } from '../db/database';
import { changesAfter, pruneChanges } from './change-log';

/** Pruning old rows is done this often by each instance (any one of them doing it is enough). */
const PRUNE_EVERY_MS = 10 * 60 * 1000;
/**
 * On PostgreSQL ids are handed out before commit, so id 11 can be visible before id 10 is: a
 * gap is waited for this long before it is taken for a rolled-back insert and passed over.
 */
const GAP_WAIT_MS = 5000;

export interface FollowerTarget {
  /** Change ids this instance wrote and applied itself. */
  applied: Set<number>;
  syncCase(id: number): Promise<void>;
  rebuild(): Promise<void>;
}

/**
 * Follows the case change log from the last id applied, every `intervalMs`: each instance's
 * index picks up writes made through the others. See change-log.ts for why a polled table.
 */
export class ChangeFollower {
  /** Every change up to here is applied. */
  private watermark = 0;
  /** Changes above the watermark already applied (there is a gap below them). */
  private ahead = new Set<number>();
  private gapSince: number | undefined;
  private timer: NodeJS.Timeout | undefined;
  private running: Promise<void> | undefined;
  private lastPrune = 0;
  /** When the last pass that found the log read to its end finished. */
  private caughtUpAt: number | undefined;

  constructor(
    private readonly db: Db,
    private readonly target: FollowerTarget,
  ) {}

  start(from: number, intervalMs: number) {
    this.watermark = from;
    this.caughtUpAt = Date.now();
    if (intervalMs <= 0) return;
    this.timer = setInterval(() => {
      this.poll().catch((err) => console.error('[falsetrace] search change log poll failed:', (err as Error).message));
    }, intervalMs);
    this.timer.unref();
  }

  /** Stops polling; resolves once a pass in progress has ended. */
  async stop() {
    clearInterval(this.timer);
    this.timer = undefined;
    await this.running?.catch(() => undefined);
  }

  /** Seconds since this instance last had every logged change applied; undefined before following starts. */
  lagSeconds(): number | undefined {
    return this.caughtUpAt === undefined ? undefined : (Date.now() - this.caughtUpAt) / 1000;
  }

  /** One pass over the log; concurrent calls share the pass in progress. */
  poll(): Promise<void> {
    this.running ??= this.pass().finally(() => (this.running = undefined));
    return this.running;
  }

  private async pass() {
    const changes = await changesAfter(this.db, this.watermark);
    const rebuild = changes.some((c) => c.case_id === null && !this.ahead.has(c.id) && !this.target.applied.has(c.id));
    if (rebuild) await this.target.rebuild();
    const seen = new Set<number>();
    for (const c of changes) {
      if (this.ahead.has(c.id)) continue;
      if (this.target.applied.delete(c.id) || c.case_id === null || rebuild) {
        this.ahead.add(c.id);
        continue;
      }
      if (!seen.has(c.case_id)) await this.target.syncCase(c.case_id);
      seen.add(c.case_id);
      this.ahead.add(c.id);
    }
    this.advance();
    if (changes.length < 1000) this.caughtUpAt = Date.now();
    if (Date.now() - this.lastPrune > PRUNE_EVERY_MS) {
      this.lastPrune = Date.now();
      await pruneChanges(this.db);
    }
  }

  /** Moves the watermark over the applied ids that follow it; over a gap once it is old. */
  private advance() {
    while (this.ahead.has(this.watermark + 1)) this.ahead.delete(++this.watermark);
    if (this.ahead.size === 0) {
      this.gapSince = undefined;
      return;
    }
    this.gapSince ??= Date.now();
    if (Date.now() - this.gapSince < GAP_WAIT_MS) return;
    // the missing ids never appeared: rolled back, or pruned
    this.watermark = Math.min(...this.ahead) - 1;
    this.gapSince = undefined;
    this.advance();
  }
}
