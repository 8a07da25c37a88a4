import type { Actor } from '../../shared/auth/roles';
import type { AuditEntry } from '../../shared/schemas/review';
import { listAudit } from '../db/repositories/audit-log';
import type { AppDeps } from '../deps';
import { visibleCaseRow } from './cases';

const parse = (t: string | null) => (t ? (JSON.parse(t) as Record<string, unknown>) : null);

/** Every state change and moderator edit of a case, newest first. */
export async function historyOf({ db }: AppDeps, actor: Actor, caseId: number): Promise<AuditEntry[]> {
  await visibleCaseRow(db, actor, caseId);
  return (await listAudit(db, caseId)).map((r) => ({
    id: r.id,
    action: r.action,
    actorName: r.actor_name,
    note: r.note,
    before: parse(r.before),
    after: parse(r.after),
    createdAt: r.created_at,
  }));
}
