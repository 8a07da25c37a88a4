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

/** Cases waiting for review, oldest submission first, each with its checklist filled in. */
export async function reviewQueue(deps: AppDeps, actor: User, filters: { cause?: string; attention?: boolean }): Promise<QueueEntry[]> {
  let q = deps.db.selectFrom('cases').select(['id', 'submitted_at', 'updated_at']).where('status', '=', 'in_review');
  if (filters.cause) q = q.where('cause', '=', filters.cause);
  const rows = await q.orderBy('submitted_at', 'asc').orderBy('id').execute();
  const entries: QueueEntry[] = [];
  for (const r of rows) {
    const c = await loadCase(deps.db, actor, r.id);
    const checklist = reviewChecklist(c);
    if (filters.attention && !checklist.some((i) => i.state === 'attention')) continue;
    entries.push({ case: c, checklist, ownCase: c.authorId === actor.id, waitingSince: r.submitted_at ?? r.updated_at });
  }
  return entries;
}

export async function waitingCount(deps: AppDeps): Promise<number> {
  const { n } = await deps.db.selectFrom('cases').select((eb) => eb.fn.countAll<number>().as('n')).where('status', '=', 'in_review').executeTakeFirstOrThrow();
  return Number(n);
}
