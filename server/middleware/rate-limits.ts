import type { NextFunction, Request, RequestHandler, Response } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { AppError } from '../errors';

const tooMany = (message: string) => (_req: Request, _res: Response, next: NextFunction) => next(new AppError('rate_limited', message));

const MINUTE = 60 * 1000;
const common = { standardHeaders: 'draft-8', legacyHeaders: false } as const;
/** The client as the server sees it; `req.ip` follows X-Forwarded-For only when TRUST_PROXY says so. */
const clientKey = (req: Request) => ipKeyGenerator(req.ip ?? '');
const emailKey = (req: Request) => String(req.body?.email ?? '').trim().toLowerCase();
const accountKey = (req: Request) => `user:${req.user?.id ?? 'anon'}`;

/** The limits, per app instance so each test gets fresh counters. Numbers are per window. */
export function createRateLimits() {
  const limit = (windowMs: number, max: number, key: (req: Request) => string, message: string, onlyFailures = false): RequestHandler =>
    rateLimit({ ...common, windowMs, limit: max, keyGenerator: key, skipSuccessfulRequests: onlyFailures, handler: tooMany(message) });
  const all = (...handlers: RequestHandler[]): RequestHandler[] => handlers;
  return {
    /** Failed sign-ins: per address and client, per account from anywhere, per client over all accounts (spraying). */
    login: all(
      limit(15 * MINUTE, 8, (r) => `${clientKey(r)}|${emailKey(r)}`, 'Too many failed sign-ins. Wait 15 minutes, or reset your password.', true),
      limit(15 * MINUTE, 10, (r) => `acct:${emailKey(r)}`, 'Too many failed sign-ins for this account. Wait 15 minutes, or reset your password.', true),
      limit(15 * MINUTE, 20, clientKey, 'Too many failed sign-ins from here. Wait 15 minutes.', true),
    ),
    /** Reset mails: per client and per address, so rotating either one does not help. */
    resetMail: all(
      limit(60 * MINUTE, 10, clientKey, 'Too many requests for mails from here. Try again in an hour.'),
      limit(60 * MINUTE, 3, (r) => `reset:${emailKey(r)}`, 'Too many reset mails for this address. Try again in an hour.'),
    ),
    /** Invitations: each one mails someone outside. */
    invitations: limit(60 * MINUTE, 20, accountKey, 'At most 20 invitations an hour. Try again later.'),
    /** Comments mail their watchers and the people they mention. */
    comments: limit(10 * MINUTE, 30, accountKey, 'At most 30 comments in 10 minutes. Slow down a little.'),
  };
}
export type RateLimits = ReturnType<typeof createRateLimits>;

/** TRUST_PROXY: unset or "0"/"false" trusts no proxy; a hop count, "loopback", or addresses/subnets (comma-separated) as Express reads them. */
export function trustProxySetting(value: string | undefined): boolean | number | string {
  if (!value || /^(0|false|no|off)$/i.test(value.trim())) return false;
  const v = value.trim();
  if (/^\d+$/.test(v)) return Number(v);
  if (/^(true|yes|on)$/i.test(v)) throw new Error('TRUST_PROXY=true would trust X-Forwarded-For from anyone; give the number of proxies or their addresses');
  return v;
}
