import type { Request, RequestHandler } from 'express';

const PATTERN = Symbol('routePattern');
type Tracked = Request & { [PATTERN]?: string };

/**
 * Notes the full route pattern (`/api/cases/:id`) at the moment a router matches a route, while
 * `req.baseUrl` still names that router's mount path: by the time the response finishes, Express
 * has already restored `baseUrl` for the routers it left.
 */
export const trackRoutePattern: RequestHandler = (req, _res, next) => {
  let route: unknown;
  Object.defineProperty(req, 'route', {
    configurable: true,
    enumerable: true,
    get: () => route,
    set(value: { path?: unknown } | undefined) {
      route = value;
      if (value && typeof value.path === 'string') (req as Tracked)[PATTERN] = `${req.baseUrl ?? ''}${value.path}`;
    },
  });
  next();
};

/**
 * The route pattern that answered, never the raw URL: bounded label values for metrics and no ids
 * or tokens in logs. Requests no route matched share three labels.
 */
export function routePatternOf(req: Request, status: number): string {
  const pattern = (req as Tracked)[PATTERN];
  if (pattern) return pattern;
  // static files, or middleware that answered before any route (CSRF, rate limits)
  return status === 404 ? '(no route)' : status < 400 ? '(static)' : '(refused)';
}

/** Segments after these carry a secret (mailed link tokens). */
const SECRET_PARENTS = new Set(['reset-password', 'accept-invitation', 'invitations', 'reset', 'unsubscribe']);
/** Words that follow those parents in our own routes and are not secrets. */
const PLAIN_WORDS = new Set(['accept', 'confirm']);
/** base64url or hex runs this long are tokens, whatever precedes them. */
const TOKEN_LIKE = /^[A-Za-z0-9_-]{24,}$/;

/** The path without query string and with every token-like segment replaced by `:redacted`. */
export function redactedPath(url: string): string {
  const pathOnly = url.split(/[?#]/, 1)[0];
  const segments = pathOnly.split('/');
  return segments
    .map((seg, i) => {
      if (!seg) return seg;
      const parent = segments[i - 1];
      if (parent && SECRET_PARENTS.has(parent.toLowerCase()) && !PLAIN_WORDS.has(seg.toLowerCase())) return ':redacted';
      if (TOKEN_LIKE.test(seg)) return ':redacted';
      return seg.length > 200 ? `${seg.slice(0, 40)}…` : seg;
    })
    .join('/');
}
