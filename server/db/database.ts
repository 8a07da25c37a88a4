import path from 'node:path';
import SQLite from 'better-sqlite3';
import { Kysely, PostgresDialect, SqliteDialect, type Generated } from 'kysely';
import pg from 'pg';
import type { Role } from '../../shared/auth/roles';
import type { CaseStatus } from '../../shared/schemas/case';

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

export interface CasesTable {
  id: Generated<number>;
  author_id: number;
  title: string;
  summary: string;
  narrative: Generated<string>;
  /** JSON of CaseSetup (SI numbers) */
  setup: Generated<string>;
  stated_cause: string | null;
  stated_cause_other: string | null;
  fix: string | null;
  lesson_summary: string | null;
  lesson_detail: string | null;
  /** Added by migration 0006; null on cases saved before it. */
  safety_note: Generated<string | null>;
  /** Added by migration 0007: the key an imported case came with (see casebook/origin-key.ts); null on cases written here. */
  origin_key: Generated<string | null>;
  status: Generated<CaseStatus>;
  /** JSON of DiagnosisResult */
  diagnosis: string | null;
  engine_cause: string | null;
  cause: string | null;
  disagrees: Generated<number>;
  review_note: string | null;
  duplicate_of: number | null;
  retired_reason: string | null;
  created_at: string;
  updated_at: string;
  submitted_at: string | null;
  verified_at: string | null;
}

export interface CaseTagsTable {
  case_id: number;
  tag: string;
  source: Generated<'author' | 'engine'>;
}

export interface AttachmentsTable {
  id: Generated<number>;
  case_id: number;
  uploaded_by: number | null;
  kind: 'screenshot' | 'capture';
  storage_name: string;
  thumbnail_name: string | null;
  original_name: string;
  content_type: string;
  size_bytes: number;
  width: number | null;
  height: number | null;
  /** JSON of the capture analysis */
  analysis: string | null;
  /** A capture taken before or after the fix (migration 0004). */
  capture_role?: 'before' | 'after' | null;
  /** The capture's analysed channel, 1-based; null: the first (migration 0004). */
  capture_channel?: number | null;
  created_at: string;
}

export interface CaseRevisionsTable {
  id: Generated<number>;
  case_id: number;
  number: number;
  author_id: number | null;
  snapshot: string;
  created_at: string;
}

export interface CommentsTable {
  id: Generated<number>;
  case_id: number;
  author_id: number;
  body: string;
  hidden: Generated<number>;
  hidden_by: number | null;
  created_at: string;
  updated_at: string;
}

export interface AuditLogTable {
  id: Generated<number>;
  case_id: number | null;
  actor_id: number | null;
  action: string;
  before: string | null;
  after: string | null;
  note: string | null;
  created_at: string;
}

export interface MailQueueTable {
  id: Generated<number>;
  to_addr: string;
  subject: string;
  text: string;
  html: string;
  attempts: Generated<number>;
  next_attempt_at: string;
  last_error: string | null;
  sent_at: string | null;
  created_at: string;
  /** The sender holding the mail while it talks to SMTP (migration 0011); null: nobody. */
  claimed_by: Generated<string | null>;
  claimed_at: Generated<string | null>;
}

/** A reset asked for an address not yet looked up (the background sender resolves and deletes it). */
export interface PasswordResetRequestsTable {
  id: Generated<number>;
  email: string;
  created_at: string;
}

/** One row per change to what search holds of a case; every app instance's index follows it. */
export interface CaseChangesTable {
  id: Generated<number>;
  /** Null: re-read every case (tag curation, an import). */
  case_id: number | null;
  changed_at: string;
}

export interface WatchesTable {
  id: Generated<number>;
  user_id: number;
  case_id: number | null;
  tag: string | null;
  created_at: string;
}

export type NotificationMode = 'instant' | 'digest' | 'off';

export interface NotificationPrefsTable {
  user_id: number;
  kind: string;
  mode: NotificationMode;
}

export interface DigestItemsTable {
  id: Generated<number>;
  user_id: number;
  kind: string;
  case_id: number | null;
  line: string;
  sent_at: string | null;
  created_at: string;
}

export interface LessonDeliveriesTable {
  user_id: number;
  case_id: number;
  sent_at: string;
}

export interface TagsTable {
  tag: string;
  description: string | null;
  retired: Generated<number>;
  created_at: string;
}

/** Kept by triggers (migration 0015): cases carrying each tag, all and verified. */
export interface TagCountsTable {
  tag: string;
  all_cases: number;
  verified_cases: number;
}

export interface TagSynonymsTable {
  synonym: string;
  tag: string;
}

export interface PinnedLessonsTable {
  case_id: number;
  position: number;
  pinned_by: number | null;
  created_at: string;
}

export interface AppStateTable {
  key: string;
  value: string;
}

export interface CaseReferencesTable {
  source_case_id: number;
  comment_id: number | null;
  target_case_id: number;
}

export interface SavedSearchesTable {
  id: Generated<number>;
  user_id: number;
  name: string;
  query: string;
  delivery: 'mail' | 'digest';
  created_at: string;
}

export interface Database {
  case_references: CaseReferencesTable;
  saved_searches: SavedSearchesTable;
  app_state: AppStateTable;
  audit_log: AuditLogTable;
  mail_queue: MailQueueTable;
  password_reset_requests: PasswordResetRequestsTable;
  case_changes: CaseChangesTable;
  watches: WatchesTable;
  notification_prefs: NotificationPrefsTable;
  digest_items: DigestItemsTable;
  lesson_deliveries: LessonDeliveriesTable;
  tags: TagsTable;
  tag_counts: TagCountsTable;
  tag_synonyms: TagSynonymsTable;
  pinned_lessons: PinnedLessonsTable;
  cases: CasesTable;
  case_tags: CaseTagsTable;
  attachments: AttachmentsTable;
  case_revisions: CaseRevisionsTable;
  comments: CommentsTable;
  users: UsersTable;
  sessions: SessionsTable;
  auth_tokens: AuthTokensTable;
  outbox_messages: OutboxMessagesTable;
}

export type Db = Kysely<Database>;

const connections = new WeakMap<Db, SQLite.Database>();

/** Opens (or creates) the SQLite file; ':memory:' for tests. WAL and foreign keys on. */
export function openDatabase(file: string): Db {
  const sqlite = new SQLite(file);
  sqlite.pragma('journal_mode = WAL');
  sqlite.pragma('foreign_keys = ON');
  sqlite.pragma('busy_timeout = 5000');
  const preparer = withStatementCache(sqlite);
  const db = new Kysely<Database>({ dialect: new SqliteDialect({ database: preparer }) });
  connections.set(db, sqlite);
  preparers.set(db, preparer);
  return db;
}

const preparers = new WeakMap<Db, { prepare(sql: string): SQLite.Statement }>();

/** What Kysely prepares every statement of a `openDatabase` instance through, cached or not (tests count the statements a request runs). */
export function statementPreparerOf(db: Db): { prepare(sql: string): SQLite.Statement } {
  const preparer = preparers.get(db);
  if (!preparer) throw new Error('This database was not opened with openDatabase');
  return preparer;
}

/** Prepared statements kept per SQL text; the app's queries are a few hundred shapes. */
const STATEMENTS_KEPT = 500;

/**
 * The connection as Kysely's SQLite driver sees it, with prepared statements reused: the driver
 * prepares every query afresh, and compiling the SQL cost a request more than running it. A
 * statement still being iterated (a streamed query) is never handed out twice.
 */
function withStatementCache(sqlite: SQLite.Database) {
  const kept = new Map<string, SQLite.Statement>();
  return {
    close: () => sqlite.close(),
    prepare(sql: string): SQLite.Statement {
      const found = kept.get(sql);
      if (found && !found.busy) {
        // Map order is insertion order: move it to the back, so the front is the least recently used
        kept.delete(sql);
        kept.set(sql, found);
        return found;
      }
      const statement = sqlite.prepare(sql);
      if (!found) {
        if (kept.size >= STATEMENTS_KEPT) kept.delete(kept.keys().next().value!);
        kept.set(sql, statement);
      }
      return statement;
    },
  };
}

/** The better-sqlite3 connection under a Kysely instance from `openDatabase` (for the online backup API). */
export function sqliteOf(db: Db): SQLite.Database {
  const sqlite = connections.get(db);
  if (!sqlite) throw new Error('This database was not opened with openDatabase');
  return sqlite;
}

// pg hands back int8 (count(*), sum of integers) and numeric as strings, since they may not fit a
// JavaScript number; our counts and sums always do, and SQLite gives numbers, so parse them here.
const INT8_OID = 20;
const NUMERIC_OID = 1700;
const pgTypes = {
  getTypeParser: ((oid: number, format?: 'text' | 'binary') => {
    if (oid === INT8_OID) return (v: string) => Number.parseInt(v, 10);
    if (oid === NUMERIC_OID) return (v: string) => Number.parseFloat(v);
    return pg.types.getTypeParser(oid, format);
  }) as typeof pg.types.getTypeParser,
};

/** A PostgreSQL database through a connection pool (DATABASE_URL=postgres://…). */
export function openPostgres(connectionString: string, options: { max?: number } = {}): Db {
  const pool = new pg.Pool({ connectionString, max: options.max ?? 10, types: pgTypes });
  // an idle client losing its connection (server restart) must not crash the process; the pool replaces it
  pool.on('error', (err) => console.error('[falsetrace] PostgreSQL connection lost:', err.message));
  return new Kysely<Database>({ dialect: new PostgresDialect({ pool }) });
}

/** The configured database: PostgreSQL when DATABASE_URL is set, else the SQLite file in DATA_DIR. */
export function openAppDatabase(config: { databaseUrl?: string; dataDir: string }): Db {
  return config.databaseUrl ? openPostgres(config.databaseUrl) : openDatabase(path.join(config.dataDir, 'falsetrace.sqlite'));
}
