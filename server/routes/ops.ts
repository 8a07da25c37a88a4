import type { Express } from 'express';
import { pingDatabase } from '../db/repositories/health';
import type { AppDeps } from '../deps';
import { bearerMatches, searchHealthOf, type AppMetrics } from '../ops/metrics';

/**
 * `GET /api/ready` (may a load balancer send traffic here: the database answers and the search
 * index is loaded) and `GET /metrics` (Prometheus text, only with METRICS_TOKEN as a bearer token).
 * Liveness stays `GET /api/health`, which touches nothing.
 */
export function mountOpsRoutes(r: Express, deps: AppDeps, metrics: AppMetrics | undefined) {
  // on the app itself, at full paths: one outside /api, and both ahead of the CSRF check

  r.get('/api/ready', async (req, res) => {
    let database: 'ok' | 'failing';
    try {
      await pingDatabase(deps.db);
      database = 'ok';
    } catch (err) {
      // the answer is public: the reason goes to the log only
      req.log.warn({ err }, 'readiness: the database does not answer');
      database = 'failing';
    }
    const search = searchHealthOf(deps)?.isReady?.() === false ? 'not ready' : 'ready';
    const ready = database === 'ok' && search === 'ready';
    res.setHeader('Cache-Control', 'no-store');
    res.status(ready ? 200 : 503).json({ ready, database, search });
  });

  r.get('/metrics', async (req, res) => {
    res.setHeader('Cache-Control', 'no-store');
    // answered here even when off, so the client's page fallback never takes the address
    if (!metrics || !deps.config.metricsToken) {
      res.status(404).json({ error: 'Metrics are off; set METRICS_TOKEN to turn them on' });
      return;
    }
    if (!bearerMatches(req.headers.authorization, deps.config.metricsToken)) {
      res.setHeader('WWW-Authenticate', 'Bearer realm="metrics"');
      res.status(401).json({ error: 'Metrics need the Authorization: Bearer <METRICS_TOKEN> header' });
      return;
    }
    res.setHeader('Content-Type', metrics.registry.contentType);
    res.send(await metrics.registry.metrics());
  });
}
