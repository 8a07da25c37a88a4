import session from 'express-session';
import type { User } from '../../shared/schemas/auth';
import type { Db } from '../db/database';
import { deleteExpiredSessions, deleteSession, getSession, TOUCH_EVERY_MS, touchSession, upsertSession } from '../db/repositories/sessions';

const DAY_MS = 24 * 60 * 60 * 1000;
/** Sessions whose stored expiry this process remembers (the most recently used kept). */
const KNOWN_EXPIRIES = 10_000;

/** Sets `key` as the most recent entry of `map`, dropping the oldest past KNOWN_EXPIRIES. */
function keepRecent<V>(map: Map<string, V>, key: string, value: V) {
  map.delete(key);
  map.set(key, value);
  if (map.size > KNOWN_EXPIRIES) map.delete(map.keys().next().value!);
}

type Callback = (err?: unknown, value?: session.SessionData | null) => void;

const expiryOf = (sess: session.SessionData) =>
  sess.cookie?.expires ? new Date(sess.cookie.expires).getTime() : Date.now() + DAY_MS;

const userIdOf = (sess: session.SessionData) => {
  const id = (sess as { passport?: { user?: unknown } }).passport?.user;
  return typeof id === 'number' ? id : null;
};

/** express-session store on the app's own database, SQLite or PostgreSQL (sessions survive restarts and are shared by every instance). */
export class SqliteSessionStore extends session.Store {
  private sweeper: NodeJS.Timeout;
  /**
   * The expiry each session row had when this process last read or wrote it. A request within a
   * minute of that leaves the row alone without a statement: one round trip fewer per request,
   * which on PostgreSQL is a good share of a cheap read. Another instance extending the row
   * meanwhile only costs an UPDATE that matches nothing.
   */
  private readonly knownExpiry = new Map<string, number>();
  /**
   * The account each session was signed in as when this process last read the session row (read
   * in the same statement), for `accountOf`: passport's deserializer then needs no statement of
   * its own, on a signed-in request's path a round trip fewer. Kept per session id, the most
   * recently read kept; a later read of the same session replaces it.
   */
  private readonly accounts = new Map<string, { userId: number; user: User | null }>();

  constructor(private readonly db: Db) {
    super();
    this.sweeper = setInterval(() => void deleteExpiredSessions(db, Date.now()).catch(() => {}), 15 * 60 * 1000);
    this.sweeper.unref();
  }

  get(sid: string, cb: Callback) {
    getSession(this.db, sid, Date.now())
      .then((row) => {
        this.accounts.delete(sid);
        if (row) {
          this.remember(sid, Number(row.expires_at));
          if (row.user_id !== null) {
            const user = row.account_id !== null && row.active === 1 ? { id: row.account_id, email: row.email!, name: row.name!, role: row.role! } : null;
            keepRecent(this.accounts, sid, { userId: Number(row.user_id), user });
          }
        }
        cb(null, row ? (JSON.parse(row.data) as session.SessionData) : null);
      })
      .catch((err) => cb(err));
  }

  /**
   * The account session `sid` was signed in as, read with the session on this request: the user
   * when the account is active, null when it is deactivated or gone; undefined when this process
   * did not read it so (or the session names another account), for the caller to look it up.
   */
  accountOf(sid: string, userId: number): User | null | undefined {
    const known = this.accounts.get(sid);
    return known && known.userId === userId ? known.user : undefined;
  }

  set(sid: string, sess: session.SessionData, cb?: (err?: unknown) => void) {
    const expiresAt = expiryOf(sess);
    upsertSession(this.db, sid, JSON.stringify(sess), userIdOf(sess), expiresAt)
      .then(() => {
        this.remember(sid, expiresAt);
        cb?.();
      })
      .catch((err) => cb?.(err));
  }

  destroy(sid: string, cb?: (err?: unknown) => void) {
    this.knownExpiry.delete(sid);
    this.accounts.delete(sid);
    deleteSession(this.db, sid)
      .then(() => cb?.())
      .catch((err) => cb?.(err));
  }

  touch(sid: string, sess: session.SessionData, cb?: (err?: unknown) => void) {
    const expiresAt = expiryOf(sess);
    const known = this.knownExpiry.get(sid);
    if (known !== undefined && expiresAt - known < TOUCH_EVERY_MS) {
      cb?.();
      return;
    }
    touchSession(this.db, sid, expiresAt)
      .then((extended) => {
        if (extended) this.remember(sid, expiresAt);
        cb?.();
      })
      .catch((err) => cb?.(err));
  }

  private remember(sid: string, expiresAt: number) {
    keepRecent(this.knownExpiry, sid, expiresAt);
  }

  close() {
    clearInterval(this.sweeper);
  }
}
