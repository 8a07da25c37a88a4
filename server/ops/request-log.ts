import { randomUUID } from 'node:crypto';
import type { IncomingMessage, ServerResponse } from 'node:http';
import type { Request, RequestHandler } from 'express';
import { pinoHttp } from 'pino-http';
import type { Logger } from '../logger';
import { redactedPath, routePatternOf } from './request-route';

/** An id a proxy or client sent is kept only when it is short and plain (it lands in logs). */
const SANE_REQUEST_ID = /^[A-Za-z0-9._:-]{1,64}$/;

function requestIdFor(req: IncomingMessage, res: ServerResponse): string {
  const incoming = req.headers['x-request-id'];
  const id = typeof incoming === 'string' && SANE_REQUEST_ID.test(incoming) ? incoming : randomUUID();
  res.setHeader('X-Request-Id', id);
  return id;
}

/**
 * One JSON line per finished request: id, method, route pattern, path with tokens cut out,
 * status, duration. Deliberately no headers (cookies, Authorization, CSRF), no query string and
 * no body: only fields built here reach the log.
 */
export function requestLog(logger: Logger): RequestHandler {
  const fields = (req: IncomingMessage, res: ServerResponse, responseTime: number) => {
    const r = req as Request;
    return {
      method: r.method,
      route: routePatternOf(r, res.statusCode),
      path: redactedPath(r.originalUrl ?? r.url ?? ''),
      status: res.statusCode,
      durationMs: responseTime,
      ...(res.writableFinished ? {} : { aborted: true }),
    };
  };
  const middleware = pinoHttp({
    logger,
    genReqId: requestIdFor,
    customAttributeKeys: { reqId: 'requestId' },
    quietReqLogger: true,
    quietResLogger: true,
    // refused requests (401, 404) are routine; only server faults are errors
    customLogLevel: (_req, res, err) => (err || res.statusCode >= 500 ? 'error' : 'info'),
    customSuccessMessage: () => 'request',
    customErrorMessage: () => 'request failed',
    customSuccessObject: (req, res, val: { responseTime: number }) => fields(req, res, val.responseTime),
    customErrorObject: (req, res, _err, val: { responseTime: number }) => fields(req, res, val.responseTime),
  });
  return middleware as unknown as RequestHandler;
}
