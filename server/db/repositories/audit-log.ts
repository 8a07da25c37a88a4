import type { Db } from '../database';

export async function recordAudit(
  db: Db,
  entry: { caseId: number | null; actorId: number; action: string; before?: unknown; after?: unknown; note?: string | null },
) {
  await db
    .insertInto('audit_log')
    .values({
      case_id: entry.caseId,
      actor_id: entry.actorId,
      action: entry.action,
      before: entry.before === undefined ? null : JSON.stringify(entry.before),
      after: entry.after === undefined ? null : JSON.stringify(entry.after),
      note: entry.note ?? null,
      created_at: new Date().toISOString(),
    })
    .execute();
}

export const listAudit = (db: Db, caseId: number) =>
  db
    .selectFrom('audit_log')
    .leftJoin('users', 'users.id', 'audit_log.actor_id')
    .selectAll('audit_log')
    .select('users.name as actor_name')
    .where('case_id', '=', caseId)
    .orderBy('audit_log.id', 'desc')
    .execute();
