import { emailSchema, personNameSchema } from '../../shared/schemas/auth';
import { hashPassword } from '../auth/password';
import type { Db } from '../db/database';
import { findUserByEmail, insertUser } from '../db/repositories/users';

/** An admin account from the command line, for a fresh install without the demo (or a locked-out team). */
export async function createAdmin(db: Db, input: { email: string; name: string; password: string }) {
  const email = emailSchema.parse(input.email);
  const name = personNameSchema.parse(input.name);
  if (await findUserByEmail(db, email)) throw new Error(`${email} already has an account; an admin can change its role on the People page`);
  const now = new Date().toISOString();
  return insertUser(db, { email, name, role: 'admin', password_hash: await hashPassword(input.password), created_at: now, updated_at: now });
}
