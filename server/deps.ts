import type { Config } from './config';
import type { Db } from './db/database';
import type { Mailer } from './mail/mailer';

/** What services need from the outside world; tests build it with an in-memory database. */
export interface AppDeps {
  db: Db;
  mailer: Mailer;
  config: Config;
}
