import type { InviteInput, Person, UpdatePersonInput, User } from '../../shared/schemas/auth';
import { newLinkToken } from '../auth/tokens';
import { insertAuthToken, pendingInvitationEmails } from '../db/repositories/auth-tokens';
import { deleteUserSessions } from '../db/repositories/sessions';
import { findUserByEmail, findUserById, listUsers, updateUser } from '../db/repositories/users';
import type { AppDeps } from '../deps';
import { AppError, invalid, notFound } from '../errors';
import { invitationMail } from '../mail/templates';
import { toPerson } from './users';

export const INVITATION_TTL_MS = 72 * 60 * 60 * 1000;

export async function listPeople({ db }: AppDeps): Promise<{ people: Person[]; pendingInvitations: string[] }> {
  const pending = await pendingInvitationEmails(db, new Date().toISOString());
  const rows = await listUsers(db);
  const known = new Set(rows.map((r) => r.email));
  return {
    people: rows.map((r) => toPerson(r, pending.has(r.email))),
    pendingInvitations: [...pending].filter((e) => !known.has(e)).sort(),
  };
}

export async function invitePerson(deps: AppDeps, inviter: User, input: InviteInput): Promise<{ email: string; expiresAt: string }> {
  const existing = await findUserByEmail(deps.db, input.email);
  if (existing?.password_hash) {
    throw new AppError('conflict', `${input.email} already has an account`, [{ path: 'email', message: 'Already has an account' }]);
  }
  const { token, tokenHash } = newLinkToken();
  const now = Date.now();
  const expiresAt = new Date(now + INVITATION_TTL_MS).toISOString();
  await insertAuthToken(deps.db, {
    kind: 'invitation',
    token_hash: tokenHash,
    email: input.email,
    role: input.role,
    created_by: inviter.id,
    expires_at: expiresAt,
    created_at: new Date(now).toISOString(),
  });
  await deps.mail.send(invitationMail(input.email, inviter.name, input.role, `${deps.config.publicUrl}/accept-invitation/${token}`));
  return { email: input.email, expiresAt };
}

export async function updatePerson(deps: AppDeps, actor: User, id: number, input: UpdatePersonInput): Promise<Person> {
  const row = await findUserById(deps.db, id);
  if (!row) throw notFound('No such person');
  if (id === actor.id && (input.active === false || (input.role && input.role !== 'admin'))) {
    throw invalid('You cannot demote or deactivate yourself; ask another admin');
  }
  const updated = await updateUser(deps.db, id, {
    ...(input.role ? { role: input.role } : {}),
    ...(input.active !== undefined ? { active: input.active ? 1 : 0 } : {}),
    updated_at: new Date().toISOString(),
  });
  // Deactivation ends sessions at once rather than at the next request's user lookup.
  if (input.active === false) await deleteUserSessions(deps.db, id);
  return toPerson(updated!, false);
}
