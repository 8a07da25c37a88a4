import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler, Response } from 'express';
import { AppError } from '../errors';

export const CSRF_COOKIE = 'ft.csrf';
export const CSRF_HEADER = 'x-csrf-token';
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * What a token is bound to: the signed-in account of the session (its id changes when passport
 * renews the session, e.g. after a rename), or "not signed in".
 */
const bindingOf = (req: Request) => (req.user ? `user:${(req.user as { id: number }).id}` : 'anonymous');

/**
 * Double-submit token: a signed random value lives in a cookie and must come back in the
 * x-csrf-token header. The signature, over the nonce and who the session is signed in as, stops
 * a cookie planted by a sibling host from passing, and a token from before sign-in (or another
 * person's) from working after it: sign-in renews the token.
 */
export function createCsrf(secret: string, secure: boolean) {
  const sign = (nonce: string, binding: string) => createHmac('sha256', secret).update(`${nonce}|${binding}`).digest('base64url');
  const isGenuine = (token: string, req: Request) => {
    const [nonce, mac] = token.split('.');
    if (!nonce || !mac) return false;
    const expected = Buffer.from(sign(nonce, bindingOf(req)));
    const given = Buffer.from(mac);
    return expected.length === given.length && timingSafeEqual(expected, given);
  };

  /** The caller's token, issuing one (and its cookie) when there is none or it is forged. */
  function tokenFor(req: Request, res: Response): string {
    const existing = req.cookies?.[CSRF_COOKIE];
    if (typeof existing === 'string' && isGenuine(existing, req)) return existing;
    const nonce = randomBytes(24).toString('base64url');
    const token = `${nonce}.${sign(nonce, bindingOf(req))}`;
    res.cookie(CSRF_COOKIE, token, { httpOnly: true, sameSite: 'lax', secure, path: '/' });
    return token;
  }

  const protect: RequestHandler = (req, _res, next) => {
    if (SAFE_METHODS.has(req.method)) return next();
    const cookie = req.cookies?.[CSRF_COOKIE];
    const header = req.get(CSRF_HEADER);
    if (typeof cookie !== 'string' || !header || cookie !== header || !isGenuine(header, req)) {
      return next(new AppError('csrf', 'Missing or wrong CSRF token: fetch /api/auth/csrf and send it in the x-csrf-token header'));
    }
    next();
  };

  return { tokenFor, protect };
}
