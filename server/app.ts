import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import express from 'express';
import session from 'express-session';
import sqliteStoreFactory from 'better-sqlite3-session-store';
import swaggerUi from 'swagger-ui-express';
import { authRoutes } from './auth/auth.routes';
import { createPassport } from './auth/passport';
import type { Deps } from './deps';
import { cachingClient } from './db/statements';
import { createApiRoutes, mountApiRoutes, readsRawBody } from './http/api';
import { errorHandler } from './http/errors';
import { originCheck, securityHeaders } from './http/security';
import { catalogRoutes } from './catalog/catalog.routes';
import { importRoutes } from './imports/imports.routes';
import { comparisonRoutes } from './comparisons/comparisons.routes';
import { forecastRoutes } from './forecast/forecast.routes';
import { planRoutes } from './plans/plans.routes';
import { auditRoutes } from './audit-log/audit.routes';
import { installPlainZodMessages } from '../shared/schemas/plain-errors';
import { agencyRoutes } from './agencies/agencies.routes';
import { memberRoutes } from './members/members.routes';
import { roleIn } from './members/members.service';
import { runRoutes } from './runs/runs.routes';
import { buildOpenApiDocument } from './openapi/openapi';
import { segmentRoutes } from './segments/segments.routes';
import { segmentHistoryRoutes } from './segment-history/segment-history.routes';

const distDir = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../dist');

export const SESSION_COOKIE = 'wearcourse.sid';

// express-session touches the store on every request; once a minute per session is enough.
function sessionStore(store: session.Store) {
  const touched = new Map<string, number>();
  const touch = store.touch?.bind(store);
  if (touch) {
    store.touch = (sid, sess, cb) => {
      const now = Date.now();
      if ((touched.get(sid) ?? 0) > now - 60_000) return cb?.();
      touched.set(sid, now);
      if (touched.size > 10_000) touched.clear();
      touch(sid, sess, cb);
    };
  }
  return store;
}
export const JSON_LIMIT = '1mb';

export function createApp(deps: Deps) {
  // Validation errors name the field in plain words (`body.widthFt — must be more than 0`).
  installPlainZodMessages();
  const app = express();
  app.disable('x-powered-by');
  if (deps.config.trustProxy) app.set('trust proxy', 1);
  app.use(securityHeaders(deps.config.appUrl.startsWith('https:')));

  app.get('/api/health', (_req, res) => {
    res.json({ ok: true });
  });

  const routes = createApiRoutes();
  const rawBody = readsRawBody(routes);
  const SqliteStore = sqliteStoreFactory(session);
  const pp = createPassport(deps);
  app.use(
    '/api',
    session({
      name: SESSION_COOKIE,
      secret: deps.config.sessionSecret,
      store: sessionStore(
        new SqliteStore({ client: cachingClient(deps.sqlite), expired: { clear: true, intervalMs: 15 * 60 * 1000 } }),
      ),
      resave: false,
      saveUninitialized: false,
      rolling: false,
      cookie: { httpOnly: true, sameSite: 'lax', secure: 'auto', maxAge: 12 * 60 * 60 * 1000 },
    }),
    pp.initialize(),
    pp.session(),
    // Routes that hand a large body to a worker read its bytes instead (RouteDef.bodyInWorker).
    express.json({
      limit: JSON_LIMIT,
      type: (req) => Boolean((req as express.Request).is('application/json')) && !rawBody(req as express.Request),
    }),
    originCheck(
      () => deps.config.appUrl,
      () => deps.config.allowedOrigins,
    ),
  );

  authRoutes(routes, deps, pp);
  segmentRoutes(routes, deps);
  segmentHistoryRoutes(routes, deps);
  memberRoutes(routes, deps);
  importRoutes(routes, deps);
  catalogRoutes(routes, deps);
  comparisonRoutes(routes, deps);
  forecastRoutes(routes, deps);
  planRoutes(routes, deps);
  auditRoutes(routes, deps);
  agencyRoutes(routes, deps);
  runRoutes(routes, deps);
  const router = express.Router();
  mountApiRoutes(router, routes, deps, {
    roleIn: (userId, agencyId) => roleIn(deps, userId, agencyId),
    jsonLimit: JSON_LIMIT,
  });
  app.use(router);

  const openapi = buildOpenApiDocument(routes.list);
  app.get('/api/openapi.json', (_req, res) => {
    res.json(openapi);
  });
  app.use('/api/docs', swaggerUi.serve, swaggerUi.setup(openapi, { customSiteTitle: 'Wearcourse API reference' }));

  app.use('/api', (_req, res) => {
    res.status(404).json({ error: { code: 'not_found', message: 'No such API route' } });
  });

  if (fs.existsSync(path.join(distDir, 'index.html'))) {
    app.use(express.static(distDir, { index: false, maxAge: '1h' }));
    app.get('/{*path}', (_req, res) => {
      res.sendFile(path.join(distDir, 'index.html'));
    });
  }

  app.use(errorHandler);
  return { app, routes: routes.list };
}
