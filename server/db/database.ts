import SQLite from 'better-sqlite3';
import { Kysely, SqliteDialect, type Generated } from 'kysely';
import type { Role } from '../../shared/auth/roles';

export interface UsersTable {
  id: Generated<number>;
  email: string;
  name: string;
  role: Role;
  password_hash: string | null;
  active: Generated<number>;
  created_at: string;
  updated_at: string;
}

export interface SessionsTable {
  sid: string;
  data: string;
  user_id: number | null;
  expires_at: number;
}

export type AuthTokenKind = 'invitation' | 'password_reset';

export interface AuthTokensTable {
  id: Generated<number>;
  kind: AuthTokenKind;
  token_hash: string;
  email: string;
  role: Role | null;
  user_id: number | null;
  created_by: number | null;
  expires_at: string;
  used_at: string | null;
  created_at: string;
}

export interface OutboxMessagesTable {
  id: Generated<number>;
  to_addr: string;
  from_addr: string;
  subject: string;
  text: string;
  html: string;
  created_at: string;
}

export interface Database {
  users: UsersTable;
  sessions: SessionsTable;
  auth_tokens: AuthTokensTable;
  outbox_messages: OutboxMessagesTable;
}

export type Db = Kysely<Database>;

/** Opens (or creates) the SQLite file; ':memory:' for tests. WAL and foreign keys on. */
export function openDatabase(file: string): Db {
  const sqlite = new SQLite(file);
  sqlite.pragma('journal_mode = WAL');
  sqlite.pragma('foreign_keys = ON');
  sqlite.pragma('busy_timeout = 5000');
  return new Kysely<Database>({ dialect: new SqliteDialect({ database: sqlite }) });
}
