import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler, Response } from 'express';
import { AppError } from '../errors';

export const CSRF_COOKIE = 'ft.csrf';
export const CSRF_HEADER = 'x-csrf-token';
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Double-submit token: a signed random value lives in a cookie and must come back in the
 * x-csrf-token header. The signature stops a cookie planted by a sibling host from passing.
 */
export function createCsrf(secret: string, secure: boolean) {
  const sign = (nonce: string) => createHmac('sha256', secret).update(nonce).digest('base64url');
  const isGenuine = (token: string) => {
    const [nonce, mac] = token.split('.');
    if (!nonce || !mac) return false;
    const expected = Buffer.from(sign(nonce));
    const given = Buffer.from(mac);
    return expected.length === given.length && timingSafeEqual(expected, given);
  };

  /** The caller's token, issuing one (and its cookie) when there is none or it is forged. */
  function tokenFor(req: Request, res: Response): string {
    const existing = req.cookies?.[CSRF_COOKIE];
    if (typeof existing === 'string' && isGenuine(existing)) return existing;
    const nonce = randomBytes(24).toString('base64url');
    const token = `${nonce}.${sign(nonce)}`;
    res.cookie(CSRF_COOKIE, token, { httpOnly: true, sameSite: 'lax', secure, path: '/' });
    return token;
  }

  const protect: RequestHandler = (req, _res, next) => {
    if (SAFE_METHODS.has(req.method)) return next();
    const cookie = req.cookies?.[CSRF_COOKIE];
    const header = req.get(CSRF_HEADER);
    if (typeof cookie !== 'string' || !header || cookie !== header || !isGenuine(header)) {
      return next(new AppError('csrf', 'Missing or wrong CSRF token: fetch /api/auth/csrf and send it in the x-csrf-token header'));
    }
    next();
  };

  return { tokenFor, protect };
}
