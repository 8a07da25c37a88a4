import type { Role } from '../../shared/auth/roles';
import { hashPassword } from '../auth/password';
import { findUserByEmail, insertUser } from '../db/repositories/users';
import type { Db } from '../db/database';

export const DEMO_ACCOUNTS: { email: string; name: string; role: Role }[] = [
  { email: 'engineer@falsetrace.test', name: 'Ines Okafor', role: 'engineer' },
  { email: 'moderator@falsetrace.test', name: 'Tomasz Lindqvist', role: 'moderator' },
  { email: 'admin@falsetrace.test', name: 'Priya Halvorsen', role: 'admin' },
];

/** Creates the demo accounts that do not exist yet (all share one password). */
export async function seedDemoUsers(db: Db, password: string): Promise<void> {
  const passwordHash = await hashPassword(password);
  const now = new Date().toISOString();
  for (const account of DEMO_ACCOUNTS) {
    if (await findUserByEmail(db, account.email)) continue;
    await insertUser(db, { ...account, password_hash: passwordHash, created_at: now, updated_at: now });
  }
}
