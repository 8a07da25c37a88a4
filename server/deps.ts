import type { Config } from './config';
import type { Db } from './db/database';
import type { Logger } from './logger';
import type { MailQueue } from './mail/mail-queue';
import type { Mailer } from './mail/mailer';
import type { CaseSearch } from './search/case-search';

/** What services need from the outside world; tests build it with an in-memory database. */
export interface AppDeps {
  db: Db;
  /** The SMTP transport; send through `mail` so nothing is lost while SMTP is down. */
  mailer: Mailer;
  mail: MailQueue;
  config: Config;
  /** The case search index; opened on first search when left out. */
  search?: CaseSearch;
  /** Request and error log; the process logger (LOG_LEVEL) when left out. */
  logger?: Logger;
}
