import type { Db, NotificationMode } from '../database';

export async function prefsOf(db: Db, userId: number): Promise<Record<string, NotificationMode>> {
  const rows = await db.selectFrom('notification_prefs').select(['kind', 'mode']).where('user_id', '=', userId).execute();
  return Object.fromEntries(rows.map((r) => [r.kind, r.mode]));
}

export async function setPref(db: Db, userId: number, kind: string, mode: NotificationMode) {
  await db
    .insertInto('notification_prefs')
    .values({ user_id: userId, kind, mode })
    .onConflict((oc) => oc.columns(['user_id', 'kind']).doUpdateSet({ mode }))
    .execute();
}

export const queueDigestItem = (db: Db, userId: number, kind: string, caseId: number | null, line: string) =>
  db.insertInto('digest_items').values({ user_id: userId, kind, case_id: caseId, line, created_at: new Date().toISOString() }).execute();
