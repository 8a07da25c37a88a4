import type { RequestHandler } from 'express';
import { gzipSync } from 'node:zlib';

/** Below this an answer goes as it is, as with the `compression` middleware's default: gzip would barely shrink it. */
export const GZIP_THRESHOLD_BYTES = 1024;

const TEXT_TYPE = /^\s*(?:text\/|application\/(?:json|javascript|xml|[\w.-]+\+(?:json|xml))|image\/svg\+xml)/i;
const NO_TRANSFORM = /(?:^|,)\s*no-transform\s*(?:,|$)/i;

/**
 * Gzips an answer sent whole (`res.json`, `res.send`) in one synchronous call. The
 * `compression` middleware opens a zlib stream per answer and hands it to the thread pool: for
 * a case-list page of ~10 KB that cost the request thread more than gzip itself. Mounted after
 * `compression`; an answer written in pieces (exports, files), a small one, a HEAD, a 204/304,
 * one marked no-transform and a client that does not take gzip are all left to it as before.
 */
export function gzipWholeAnswers(level: number): RequestHandler {
  return (req, res, next) => {
    // a client that names no encoding gets the answer plain, as compression sends it
    if (req.headers['accept-encoding'] === undefined || req.method === 'HEAD' || req.acceptsEncodings('gzip') !== 'gzip') return next();
    const write = res.write;
    const end = res.end as (...a: unknown[]) => typeof res;
    let streamed = false;
    res.write = function (this: typeof res, ...args: unknown[]) {
      streamed = true;
      return (write as (...a: unknown[]) => boolean).apply(this, args);
    } as typeof res.write;
    res.end = function (this: typeof res, ...args: unknown[]) {
      const [chunk, encoding] = args;
      const whole =
        !streamed &&
        !res.headersSent &&
        args.length <= 2 &&
        (typeof chunk === 'string' || chunk instanceof Uint8Array) &&
        (encoding === undefined || typeof encoding === 'string') &&
        res.statusCode !== 204 &&
        res.statusCode !== 304 &&
        res.getHeader('Content-Encoding') === undefined &&
        TEXT_TYPE.test(String(res.getHeader('Content-Type') ?? '')) &&
        !NO_TRANSFORM.test(String(res.getHeader('Cache-Control') ?? ''));
      if (!whole) return end.apply(this, args);
      const body = typeof chunk === 'string' ? Buffer.from(chunk, (encoding as BufferEncoding | undefined) ?? 'utf8') : (chunk as Uint8Array);
      res.vary('Accept-Encoding');
      if (body.length < GZIP_THRESHOLD_BYTES) return end.apply(this, args);
      const zipped = gzipSync(body, { level });
      res.setHeader('Content-Encoding', 'gzip');
      res.setHeader('Content-Length', zipped.length);
      return end.call(this, zipped);
    } as typeof res.end;
    next();
  };
}
