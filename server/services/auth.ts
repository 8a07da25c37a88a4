import type { AcceptInvitationInput, ChangePasswordInput, ResetConfirmInput, User } from '../../shared/schemas/auth';
import { dummyPasswordHash, hashPassword, verifyPassword } from '../auth/password';
import { hashLinkToken, newLinkToken } from '../auth/tokens';
import { consumeAuthToken, findAuthToken, insertAuthToken } from '../db/repositories/auth-tokens';
import { deleteResetRequest, insertResetRequest, pendingResetRequests } from '../db/repositories/password-reset-requests';
import { deleteUserSessions } from '../db/repositories/sessions';
import { findUserByEmail, findUserById, insertUser, updateUser } from '../db/repositories/users';
import type { AppDeps } from '../deps';
import { AppError, invalid } from '../errors';
import { passwordResetMail } from '../mail/templates';
import { toUser } from './users';

export const RESET_TTL_MS = 60 * 60 * 1000;

/** The signed-in user for valid credentials of an active account, else null (same time either way). */
export async function authenticate({ db }: AppDeps, email: string, password: string): Promise<User | null> {
  const row = await findUserByEmail(db, email);
  const ok = await verifyPassword(password, row?.password_hash ?? (await dummyPasswordHash()));
  if (!row || !ok || row.active !== 1) return null;
  return toUser(row);
}

/** The user behind a session, or null when the account is gone or deactivated. */
export async function activeUser({ db }: AppDeps, id: number): Promise<User | null> {
  const row = await findUserById(db, id);
  return row && row.active === 1 ? toUser(row) : null;
}

async function usableToken(deps: AppDeps, kind: 'invitation' | 'password_reset', token: string) {
  const row = await findAuthToken(deps.db, kind, hashLinkToken(token));
  if (!row) throw new AppError('not_found', 'This link is not valid. Ask for a new one.');
  if (row.used_at) throw new AppError('gone', 'This link was already used. Ask for a new one.');
  if (new Date(row.expires_at).getTime() <= Date.now()) throw new AppError('gone', 'This link has expired. Ask for a new one.');
  return row;
}

export async function describeInvitation(deps: AppDeps, token: string) {
  const row = await usableToken(deps, 'invitation', token);
  return { email: row.email, role: row.role ?? 'engineer' };
}

export async function acceptInvitation(deps: AppDeps, input: AcceptInvitationInput): Promise<User> {
  const row = await usableToken(deps, 'invitation', input.token);
  const passwordHash = await hashPassword(input.password);
  const now = new Date().toISOString();
  return deps.db.transaction().execute(async (trx) => {
    if (!(await consumeAuthToken(trx, row.id, now))) throw new AppError('gone', 'This link was already used. Ask for a new one.');
    const existing = await findUserByEmail(trx, row.email);
    if (existing && existing.password_hash) throw new AppError('conflict', 'An account with this e-mail already exists. Sign in instead.');
    const user = existing
      ? await updateUser(trx, existing.id, { name: input.name, password_hash: passwordHash, active: 1, updated_at: now })
      : await insertUser(trx, {
          email: row.email,
          name: input.name,
          role: row.role ?? 'engineer',
          password_hash: passwordHash,
          created_at: now,
          updated_at: now,
        });
    return toUser(user!);
  });
}

/**
 * Writes the request down and wakes the background sender: the same single write whether or not
 * the address has an account, so neither the answer nor its time says which (the lookup, the
 * link and the mail happen later, in `resolvePasswordResetRequests`).
 */
export async function requestPasswordReset(deps: AppDeps, email: string): Promise<void> {
  await insertResetRequest(deps.db, email, new Date().toISOString());
  deps.mail.wake();
}

/** Run by the mail queue before each sweep: a reset link for each request from an active account. */
export async function resolvePasswordResetRequests({ db, config, mail }: Pick<AppDeps, 'db' | 'config' | 'mail'>): Promise<number> {
  let mailed = 0;
  for (const request of await pendingResetRequests(db)) {
    const user = await findUserByEmail(db, request.email);
    await db.transaction().execute(async (trx) => {
      // the delete is the claim: another instance sweeping at the same time gets false and mails nothing
      if (!(await deleteResetRequest(trx, request.id))) return;
      if (!user || user.active !== 1) return;
      const { token, tokenHash } = newLinkToken();
      // the link lives an hour from when it was asked for, not from when the sender got to it
      const askedAt = new Date(request.created_at).getTime();
      await insertAuthToken(trx, {
        kind: 'password_reset',
        token_hash: tokenHash,
        email: user.email,
        user_id: user.id,
        expires_at: new Date(askedAt + RESET_TTL_MS).toISOString(),
        created_at: request.created_at,
      });
      await mail.enqueue(passwordResetMail(user.email, `${config.publicUrl}/reset-password/${token}`), trx);
      mailed++;
    });
  }
  return mailed;
}

export async function confirmPasswordReset(deps: AppDeps, input: ResetConfirmInput): Promise<void> {
  const row = await usableToken(deps, 'password_reset', input.token);
  const passwordHash = await hashPassword(input.password);
  const now = new Date().toISOString();
  await deps.db.transaction().execute(async (trx) => {
    if (!(await consumeAuthToken(trx, row.id, now))) throw new AppError('gone', 'This link was already used. Ask for a new one.');
    // every other reset link of this person ends with this one
    await trx.updateTable('auth_tokens').set({ used_at: now }).where('kind', '=', 'password_reset').where('user_id', '=', row.user_id!).where('used_at', 'is', null).execute();
    await updateUser(trx, row.user_id!, { password_hash: passwordHash, updated_at: now });
    await deleteUserSessions(trx, row.user_id!);
  });
}

export async function changePassword(deps: AppDeps, userId: number, input: ChangePasswordInput, keepSid: string) {
  const row = await findUserById(deps.db, userId);
  if (!row || !(await verifyPassword(input.currentPassword, row.password_hash))) {
    throw invalid('Your current password is not right', [{ path: 'currentPassword', message: 'Not your current password' }]);
  }
  await updateUser(deps.db, userId, { password_hash: await hashPassword(input.newPassword), updated_at: new Date().toISOString() });
  await deleteUserSessions(deps.db, userId, keepSid);
}

export async function renameUser(deps: AppDeps, userId: number, name: string): Promise<User> {
  const row = await updateUser(deps.db, userId, { name, updated_at: new Date().toISOString() });
  return toUser(row!);
}
