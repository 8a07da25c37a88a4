import { existsSync } from 'node:fs';
import path from 'node:path';
import { constants as zlibConstants } from 'node:zlib';
import compression from 'compression';
import cookieParser from 'cookie-parser';
import express from 'express';
import session from 'express-session';
import helmet from 'helmet';
import { createPassport } from './auth/passport';
import { SqliteSessionStore } from './auth/session-store';
import type { AppDeps } from './deps';
import { AppError } from './errors';
import { createCsrf } from './middleware/csrf';
import { errorHandler } from './middleware/error-handler';
import { gzipWholeAnswers } from './middleware/gzip-whole';
import { logger as processLogger } from './logger';
import { requestLog } from './ops/request-log';
import { trackRoutePattern } from './ops/request-route';
import { createMetrics } from './ops/metrics';
import { mountOpsRoutes } from './routes/ops';
import { attachmentRoutes } from './routes/attachments';
import { backupRoutes } from './routes/backup';
import { authRoutes } from './routes/auth';
import { casebookRoutes } from './routes/casebook';
import { captureRoutes } from './routes/captures';
import { caseRoutes } from './routes/cases';
import { commentRoutes } from './routes/comments';
import { diagnosisRoutes } from './routes/diagnosis';
import { lessonRoutes } from './routes/lessons';
import { notificationRoutes } from './routes/notifications';
import { savedSearchRoutes } from './routes/saved-searches';
import { outboxRoutes } from './routes/outbox';
import { peopleRoutes } from './routes/people';
import { profileRoutes } from './routes/profile';
import { reviewRoutes } from './routes/review';
import { searchRoutes, similarCaseRoutes } from './routes/search';
import { tagRoutes } from './routes/tags';
import { traceRoutes } from './routes/traces';
import { captureAttachmentRoutes } from './routes/capture-attachments';

export interface AppOptions {
  /** Folder of the built client (vite build); served with an SPA fallback when present. */
  clientDir?: string;
}

export const SESSION_COOKIE = 'ft.sid';

/** Builds the Express app without listening, so tests drive it with supertest. */
export function createApp(deps: AppDeps, options: AppOptions = {}) {
  const { config } = deps;
  const app = express();
  app.disable('x-powered-by');
  // X-Forwarded-For names the client only behind a proxy the operator named (TRUST_PROXY)
  app.set('trust proxy', config.trustProxy ?? false);
  // first, so the log line and its duration cover everything below
  app.use(trackRoutePattern, requestLog(deps.logger ?? processLogger));
  const metrics = config.metricsToken ? createMetrics(deps) : undefined;
  if (metrics) app.use(metrics.observe);

  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          // React and the plot library set element styles at run time
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'", 'data:'],
          connectSrc: ["'self'"],
          objectSrc: ["'none'"],
          frameAncestors: ["'none'"],
          upgradeInsecureRequests: config.production ? [] : null,
        },
      },
      crossOriginEmbedderPolicy: false,
      strictTransportSecurity: config.production,
    }),
  );
  // gzip every text answer (JSON, scripts, styles, CSV); zips and images go as they are. API
  // answers are made per request, so they take zlib's fastest level (the default level cost a
  // case-list request more than its SQL); assets are compressed once per download at the default.
  const fastCompression = compression({ level: zlibConstants.Z_BEST_SPEED });
  const compressAssets = compression();
  app.use((req, res, next) => (req.path.startsWith('/api/') ? fastCompression : compressAssets)(req, res, next));
  // an API answer sent whole is gzipped in one call, without a zlib stream per request
  app.use('/api', gzipWholeAnswers(zlibConstants.Z_BEST_SPEED));
  app.use(express.json({ limit: '1mb' }));
  app.use(cookieParser());

  const store = new SqliteSessionStore(deps.db);
  app.locals.sessionStore = store;
  app.use(
    session({
      name: SESSION_COOKIE,
      secret: config.sessionSecret,
      store,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: { httpOnly: true, sameSite: 'lax', secure: config.production, maxAge: 7 * 24 * 60 * 60 * 1000 },
    }),
  );
  const passport = createPassport(deps, store);
  app.use(passport.initialize());
  app.use(passport.session());

  const csrf = createCsrf(config.sessionSecret, config.production);
  app.get('/api/health', (_req, res) => {
    res.json({ ok: true });
  });
  mountOpsRoutes(app, deps, metrics);
  app.use('/api', csrf.protect);
  app.use('/api/auth', authRoutes(deps, passport, csrf.tokenFor));
  app.use('/api/profile', profileRoutes(deps));
  app.use('/api/profile', notificationRoutes(deps));
  app.use('/api/profile/saved-searches', savedSearchRoutes(deps));
  app.use('/api/admin/people', peopleRoutes(deps));
  app.use('/api/admin/casebook', casebookRoutes(deps));
  app.use('/api/admin/backup', backupRoutes(deps));
  app.use('/api/dev/outbox', outboxRoutes(deps));
  app.use('/api/cases', caseRoutes(deps));
  app.use('/api/cases', similarCaseRoutes(deps));
  app.use('/api/search', searchRoutes(deps));
  app.use('/api/comments', commentRoutes(deps));
  app.use('/api/attachments', attachmentRoutes(deps));
  app.use('/api/attachments', traceRoutes(deps));
  app.use('/api/attachments', captureAttachmentRoutes(deps));
  app.use('/api/diagnosis', diagnosisRoutes());
  app.use('/api/captures', captureRoutes(deps));
  app.use('/api/review', reviewRoutes(deps));
  app.use('/api/lessons', lessonRoutes(deps));
  app.use('/api/tags', tagRoutes(deps));
  app.use('/api', (req, _res, next) => next(new AppError('not_found', `No API route ${req.method} ${req.path}`)));

  const clientDir = options.clientDir;
  if (clientDir && existsSync(path.join(clientDir, 'index.html'))) {
    // Vite names every built asset after its content hash, so those never change: cache a year
    app.use('/assets', express.static(path.join(clientDir, 'assets'), { index: false, maxAge: '365d', immutable: true }));
    app.use(express.static(clientDir, { index: false, maxAge: '1h' }));
    // a screen's script from an older build is gone: say so, rather than answer with the page
    app.use('/assets', (req, _res, next) => next(new AppError('not_found', `No such file /assets${req.path}; reload the page`)));
    app.get('/{*splat}', (_req, res) => {
      res.sendFile(path.join(clientDir, 'index.html'), { headers: { 'Cache-Control': 'no-cache' } });
    });
  }

  app.use(errorHandler);
  return app;
}
