import type { Insertable, Selectable } from 'kysely';
import type { AuthTokenKind, AuthTokensTable, Db } from '../database';

export type AuthTokenRow = Selectable<AuthTokensTable>;

export const insertAuthToken = (db: Db, row: Insertable<AuthTokensTable>) =>
  db.insertInto('auth_tokens').values(row).returningAll().executeTakeFirstOrThrow();

export const findAuthToken = (db: Db, kind: AuthTokenKind, tokenHash: string) =>
  db.selectFrom('auth_tokens').selectAll().where('kind', '=', kind).where('token_hash', '=', tokenHash).executeTakeFirst();

/** Marks a token used only if it was still unused; returns false when another request won the race. */
export async function consumeAuthToken(db: Db, id: number, nowIso: string): Promise<boolean> {
  const r = await db
    .updateTable('auth_tokens')
    .set({ used_at: nowIso })
    .where('id', '=', id)
    .where('used_at', 'is', null)
    .executeTakeFirst();
  return Number(r.numUpdatedRows) === 1;
}

/** Emails with an invitation that is neither used nor expired. */
export async function pendingInvitationEmails(db: Db, nowIso: string): Promise<Set<string>> {
  const rows = await db
    .selectFrom('auth_tokens')
    .select('email')
    .where('kind', '=', 'invitation')
    .where('used_at', 'is', null)
    .where('expires_at', '>', nowIso)
    .execute();
  return new Set(rows.map((r) => r.email));
}
