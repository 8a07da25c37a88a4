import { timingSafeEqual, createHash } from 'node:crypto';
import type { Request, RequestHandler } from 'express';
import { Gauge, Histogram, Registry, collectDefaultMetrics } from 'prom-client';
import { pendingMailCount } from '../db/repositories/mail-queue';
import type { AppDeps } from '../deps';
import { routePatternOf } from './request-route';

/** What the search index may report; another part of the server adds these to the search object. */
interface SearchHealth {
  lagSeconds?: () => number | undefined;
  isReady?: () => boolean;
}
export const searchHealthOf = (deps: AppDeps) => deps.search as (AppDeps['search'] & SearchHealth) | undefined;

const METHODS = new Set(['GET', 'HEAD', 'POST', 'PUT', 'PATCH', 'DELETE', 'OPTIONS']);

export interface AppMetrics {
  registry: Registry;
  /** Times every request into the latency histogram when it finishes. */
  observe: RequestHandler;
}

/**
 * One registry per app (tests build several apps in one process). Labels stay bounded: the route
 * pattern, a known method, and the status class, never a raw URL.
 */
export function createMetrics(deps: AppDeps): AppMetrics {
  const registry = new Registry();
  collectDefaultMetrics({ register: registry });
  const latency = new Histogram({
    name: 'falsetrace_http_request_duration_seconds',
    help: 'Time from a request arriving to its response finishing, by route pattern, method and status class',
    labelNames: ['route', 'method', 'status_class'] as const,
    buckets: [0.005, 0.01, 0.025, 0.05, 0.1, 0.25, 0.5, 1, 2.5, 5, 10],
    registers: [registry],
  });
  new Gauge({
    name: 'falsetrace_mail_queue_pending',
    help: 'Mails stored in the queue and not yet delivered',
    registers: [registry],
    async collect() {
      this.set(await pendingMailCount(deps.db));
    },
  });
  // labelled so that "unknown" is no sample at all rather than a misleading 0
  new Gauge({
    name: 'falsetrace_search_index_lag_seconds',
    help: 'How far this instance\'s search index is behind the database (no sample when the index does not say)',
    labelNames: ['index'] as const,
    registers: [registry],
    collect() {
      this.reset();
      const lag = searchHealthOf(deps)?.lagSeconds?.();
      if (typeof lag === 'number' && Number.isFinite(lag)) this.set({ index: 'cases' }, lag);
    },
  });

  const observe: RequestHandler = (req, res, next) => {
    const started = process.hrtime.bigint();
    res.once('finish', () => {
      const seconds = Number(process.hrtime.bigint() - started) / 1e9;
      latency.observe({ route: routePatternOf(req as Request, res.statusCode), method: METHODS.has(req.method) ? req.method : 'OTHER', status_class: `${Math.floor(res.statusCode / 100)}xx` }, seconds);
    });
    next();
  };
  return { registry, observe };
}

const digest = (s: string) => createHash('sha256').update(s).digest();

/** Compares hashes so neither the length nor the content of the token leaks through timing. */
export function bearerMatches(header: string | undefined, token: string): boolean {
  const given = header?.match(/^Bearer\s+(\S+)\s*$/i)?.[1];
  return given !== undefined && timingSafeEqual(digest(given), digest(token));
}
