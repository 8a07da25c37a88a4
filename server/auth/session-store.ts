import session from 'express-session';
import type { Db } from '../db/database';
import { deleteExpiredSessions, deleteSession, getSession, touchSession, upsertSession } from '../db/repositories/sessions';

const DAY_MS = 24 * 60 * 60 * 1000;

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

  constructor(private readonly db: Db) {
    super();
    this.sweeper = setInterval(() => void deleteExpiredSessions(db, Date.now()).catch(() => {}), 15 * 60 * 1000);
    this.sweeper.unref();
  }

  get(sid: string, cb: Callback) {
    getSession(this.db, sid, Date.now())
      .then((row) => cb(null, row ? (JSON.parse(row.data) as session.SessionData) : null))
      .catch((err) => cb(err));
  }

  set(sid: string, sess: session.SessionData, cb?: (err?: unknown) => void) {
    upsertSession(this.db, sid, JSON.stringify(sess), userIdOf(sess), expiryOf(sess))
      .then(() => cb?.())
      .catch((err) => cb?.(err));
  }

  destroy(sid: string, cb?: (err?: unknown) => void) {
    deleteSession(this.db, sid)
      .then(() => cb?.())
      .catch((err) => cb?.(err));
  }

  touch(sid: string, sess: session.SessionData, cb?: (err?: unknown) => void) {
    touchSession(this.db, sid, expiryOf(sess))
      .then(() => cb?.())
      .catch((err) => cb?.(err));
  }

  close() {
    clearInterval(this.sweeper);
  }
}
