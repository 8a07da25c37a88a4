import { randomBytes } from 'node:crypto';
import { hostname } from 'node:os';
import type { Selectable } from 'kysely';
import type { Db, MailQueueTable } from '../db/database';
import { claimNextMail, insertQueuedMail, markMailFailed, markMailSent } from '../db/repositories/mail-queue';
import { logger } from '../logger';
import type { MailMessage, Mailer } from './mailer';

/** Backoff after the n-th failed attempt: 30 s, 1 min, 2 min … capped at 1 h. */
export const retryDelayMs = (attempts: number) => Math.min(30_000 * 2 ** Math.max(0, attempts - 1), 60 * 60 * 1000);

export interface MailQueue {
  /**
   * Stores the mail and wakes the background sender; never waits for SMTP, so a mail server that
   * hangs cannot hold a request. A failure leaves the mail queued for retry.
   */
  send(message: MailMessage): Promise<void>;
  /** Stores the mail (inside the caller's transaction when given) for the next sweep. */
  enqueue(message: MailMessage, trx?: Db): Promise<void>;
  /** Starts a sweep soon (after the one running), without waiting for it. */
  wake(): void;
  /** Tries every mail whose retry time has come; returns how many went out. */
  retryDue(now?: Date): Promise<number>;
  start(intervalMs?: number): void;
  stop(): void;
}

/** The real queue, which also lets tests, scripts and shutdown wait for it. */
export interface BackgroundMailQueue extends MailQueue {
  /** Waits for a sweep in progress, then delivers everything due now. */
  flush(): Promise<number>;
  /** Resolves when no sweep is running (after `stop`, at shutdown). */
  idle(): Promise<void>;
}

export interface MailQueueOptions {
  /** Work that turns requests into mails (password resets), run at the start of every sweep. */
  prepare?: (queue: MailQueue) => Promise<unknown>;
  /** Who claims mails (several instances share one queue); default host, process and a random part. */
  claimer?: string;
  /**
   * A claim older than this is taken over: its sender died between claiming and sending. Far
   * above one SMTP exchange (the mailer's timeouts are seconds), so a live sender keeps its mail.
   */
  claimTimeoutMs?: number;
}

/** Mails one sweep sends at most; the rest wait for the next sweep (every 15 s, or a wake). */
const SWEEP_LIMIT = 20;
export const DEFAULT_CLAIM_TIMEOUT_MS = 10 * 60 * 1000;

export function createMailQueue(db: Db, mailer: Mailer, options: MailQueueOptions = {}): BackgroundMailQueue {
  let timer: NodeJS.Timeout | undefined;
  let running: Promise<number> | undefined;
  const claimer = options.claimer ?? `${hostname()}:${process.pid}:${randomBytes(4).toString('hex')}`;
  const claimTimeoutMs = options.claimTimeoutMs ?? DEFAULT_CLAIM_TIMEOUT_MS;

  /** Sends one claimed mail; a failure puts it back (unclaimed) for a later retry. */
  async function attempt(row: Selectable<MailQueueTable>, now: Date): Promise<boolean> {
    const id = row.id;
    try {
      await mailer.send({ to: row.to_addr, subject: row.subject, text: row.text, html: row.html });
      await markMailSent(db, id, new Date().toISOString());
      return true;
    } catch (err) {
      const attempts = row.attempts + 1;
      logger.warn({ mailId: id, attempts, reason: String((err as Error).message ?? err) }, 'mail delivery failed; it stays queued for retry');
      await markMailFailed(db, id, attempts, new Date(now.getTime() + retryDelayMs(attempts)).toISOString(), String((err as Error).message ?? err));
      return false;
    }
  }

  let stopped = false;
  let wakeQueued = false;
  /** One more sweep after the current one (a mail stored during a sweep is not in its list). */
  function wake() {
    if (stopped || wakeQueued) return;
    wakeQueued = true;
    void (running ?? Promise.resolve())
      .catch(() => undefined)
      .then(() => {
        wakeQueued = false;
        return stopped ? 0 : retryDue();
      })
      .catch((err) => logger.error({ err }, 'mail sending failed'));
  }

  async function retryDue(now = new Date()): Promise<number> {
    // one sweep at a time, so a slow SMTP server never gets the same mail twice
    running ??= (async () => {
      let sent = 0;
      await options.prepare?.(queue).catch((err) => logger.error({ err }, 'preparing mails failed'));
      // what prepare just queued is due too
      const due = new Date(Math.max(now.getTime(), Date.now()));
      // claimed one by one: another instance sweeping at the same time takes the other rows
      for (let n = 0; n < SWEEP_LIMIT; n++) {
        // the claim's age is real time, whatever `now` a caller passes to make retries due
        const claimedAt = Date.now();
        const row = await claimNextMail(db, claimer, due.toISOString(), new Date(claimedAt - claimTimeoutMs).toISOString(), new Date(claimedAt).toISOString());
        if (!row) break;
        if (await attempt(row, now)) sent++;
      }
      return sent;
    })().finally(() => (running = undefined));
    return running;
  }

  const queue: BackgroundMailQueue = {
    async send(message) {
      const now = new Date().toISOString();
      await insertQueuedMail(db, { to_addr: message.to, subject: message.subject, text: message.text, html: message.html, next_attempt_at: now, created_at: now });
      wake();
    },
    async enqueue(message, trx) {
      const now = new Date().toISOString();
      await insertQueuedMail(trx ?? db, { to_addr: message.to, subject: message.subject, text: message.text, html: message.html, next_attempt_at: now, created_at: now });
    },
    wake,
    retryDue,
    async flush() {
      await running?.catch(() => undefined);
      return retryDue();
    },
    async idle() {
      while (running || wakeQueued) await (running ?? new Promise((r) => setTimeout(r, 10))).catch(() => undefined);
    },
    start(intervalMs = 15_000) {
      timer = setInterval(() => void retryDue().catch((err) => logger.error({ err }, 'mail retry failed')), intervalMs);
      timer.unref();
    },
    stop() {
      stopped = true;
      if (timer) clearInterval(timer);
    },
  };
  return queue;
}
