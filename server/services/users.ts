import type { Person, User } from '../../shared/schemas/auth';
import type { UserRow } from '../db/repositories/users';

export const toUser = (row: UserRow): User => ({ id: row.id, email: row.email, name: row.name, role: row.role });

export const toPerson = (row: UserRow, pendingInvitation: boolean): Person => ({
  ...toUser(row),
  active: row.active === 1,
  createdAt: row.created_at,
  pendingInvitation,
});
