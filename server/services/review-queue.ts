import type { User } from '../../shared/schemas/auth';
import { reviewChecklist, type CheckItem } from '../../shared/review/checklist';
import type { Case } from '../../shared/schemas/case';
import type { AppDeps } from '../deps';
import { loadCase } from './cases';

export interface QueueEntry {
  case: Case;
  checklist: CheckItem[];
  /** The reviewer wrote the case: someone else must review it. */
  ownCase: boolean;
  waitingSince: string;
}

/** The desk shows this many waiting cases at a time, oldest first; deciding them brings the next ones up. */
export const QUEUE_PAGE = 50;

/**
 * The oldest QUEUE_PAGE cases waiting for review (matching the filters), each with its checklist
 * filled in, and how many wait in all for the cause filter. Cases are read a batch at a time, so
 * a desk with thousands waiting loads only what it shows.
 */
export async function reviewQueue(deps: AppDeps, actor: User, filters: { cause?: string; attention?: boolean }): Promise<{ entries: QueueEntry[]; waiting: number }> {
  let q = deps.db.selectFrom('cases').where('status', '=', 'in_review');
  if (filters.cause) q = q.where('cause', '=', filters.cause);
  const { n } = await q.select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow();
  const entries: QueueEntry[] = [];
  for (let offset = 0; entries.length < QUEUE_PAGE; offset += QUEUE_PAGE) {
    const rows = await q.select(['id', 'submitted_at', 'updated_at']).orderBy('submitted_at', 'asc').orderBy('id').limit(QUEUE_PAGE).offset(offset).execute();
    for (const r of rows) {
      const c = await loadCase(deps.db, actor, r.id);
      const checklist = reviewChecklist(c);
      if (filters.attention && !checklist.some((i) => i.state === 'attention')) continue;
      if (entries.length < QUEUE_PAGE) entries.push({ case: c, checklist, ownCase: c.authorId === actor.id, waitingSince: r.submitted_at ?? r.updated_at });
    }
    if (rows.length < QUEUE_PAGE) break;
  }
  return { entries, waiting: Number(n) };
}

export async function waitingCount(deps: AppDeps): Promise<number> {
  const { n } = await deps.db.selectFrom('cases').select((eb) => eb.fn.countAll<number>().as('n')).where('status', '=', 'in_review').executeTakeFirstOrThrow();
  return Number(n);
}
