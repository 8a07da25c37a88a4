import type { Insertable, Selectable, Updateable } from 'kysely';
import type { Db, UsersTable } from '../database';

export type UserRow = Selectable<UsersTable>;

export const findUserById = (db: Db, id: number) =>
  db.selectFrom('users').selectAll().where('id', '=', id).executeTakeFirst();

export const findUserByEmail = (db: Db, email: string) =>
  db.selectFrom('users').selectAll().where('email', '=', email.toLowerCase()).executeTakeFirst();

export const listUsers = (db: Db) => db.selectFrom('users').selectAll().orderBy('name').execute();

export const countUsers = async (db: Db) =>
  Number((await db.selectFrom('users').select((eb) => eb.fn.countAll().as('n')).executeTakeFirstOrThrow()).n);

export const listUsersWithRole = (db: Db, roles: UsersTable['role'][]) =>
  db.selectFrom('users').selectAll().where('role', 'in', roles).where('active', '=', 1).execute();

export async function insertUser(db: Db, user: Insertable<UsersTable>): Promise<UserRow> {
  return db.insertInto('users').values(user).returningAll().executeTakeFirstOrThrow();
}

export async function updateUser(db: Db, id: number, patch: Updateable<UsersTable>): Promise<UserRow | undefined> {
  return db.updateTable('users').set(patch).where('id', '=', id).returningAll().executeTakeFirst();
}
