import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { randomBytes } from 'node:crypto';
import { RequestContext } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/sqlite';
import connectSqlite3 from 'connect-sqlite3';
import { csrfSync } from 'csrf-sync';
import express, { type Express } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import swaggerUi from 'swagger-ui-express';
import { loadSessionUser } from '../modules/auth/session-user';
import { allRoutes } from '../modules/routes';
import type { AppDeps } from './deps';
import { AppError, apiNotFound, errorHandler } from './errors';
import { requestLogging } from './logging';
import { buildOpenApi } from './openapi';
import { mountRoutes } from './route';

export const APP_VERSION = '0.1.0';

/** The session secret: from the environment, or made once and kept in the data folder. */
function sessionSecret(deps: AppDeps): string {
  if (deps.env.sessionSecret) return deps.env.sessionSecret;
  const file = join(deps.env.dataDir, 'session-secret');
  if (!existsSync(file)) writeFileSync(file, randomBytes(48).toString('hex'), { mode: 0o600 });
  return readFileSync(file, 'utf8').trim();
}

export interface CreateAppOptions {
  /** Folder of the built web app to serve with a single-page fallback. */
  webDist?: string;
}

/** Builds the Express app (no listen): API, sessions, CSRF, docs, and optionally the web app. */
export function createApp(deps: AppDeps, options: CreateAppOptions = {}): Express {
  mkdirSync(deps.env.dataDir, { recursive: true });
  const app = express();
  app.disable('x-powered-by');
  // Behind a reverse proxy set SPLITCASE_TRUST_PROXY (e.g. `loopback`); without one, X-Forwarded-* are ignored.
  app.set('trust proxy', deps.env.trustProxy);
  app.use(requestLogging(deps.logger));

  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          'default-src': ["'self'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'style-src': ["'self'", "'unsafe-inline'"],
          'script-src': ["'self'"],
          'connect-src': ["'self'"],
          'font-src': ["'self'", 'data:'],
          'object-src': ["'none'"],
          'frame-ancestors': ["'none'"],
          'upgrade-insecure-requests': deps.env.secureCookies ? [] : null,
        },
      },
      crossOriginEmbedderPolicy: false,
    }),
  );

  const SQLiteStore = connectSqlite3(session);
  const api = express.Router();
  api.use('/api', express.json({ limit: '1mb' }));
  api.use(
    '/api',
    session({
      name: 'splitcase.sid',
      secret: sessionSecret(deps),
      store: new SQLiteStore({ dir: deps.env.dataDir, db: 'sessions.sqlite', table: 'sessions' }) as unknown as session.Store,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      // maxAge is set per session from the workspace's session limits (modules/auth/sessions.ts).
      cookie: { httpOnly: true, sameSite: 'lax', secure: deps.env.secureCookies, maxAge: 12 * 3600 * 1000 },
    }),
  );
  const { csrfSynchronisedProtection } = csrfSync({
    getTokenFromRequest: (req) => req.get('x-csrf-token') ?? undefined,
    errorConfig: { statusCode: 403, code: 'EBADCSRFTOKEN', message: 'invalid csrf token' },
  });
  api.use('/api', csrfSynchronisedProtection);
  api.use('/api', (_req, _res, next) => RequestContext.create(deps.orm.em, next));
  const getEm = () => RequestContext.getEntityManager() as EntityManager;
  api.use('/api', loadSessionUser(getEm));

  const defs = allRoutes(deps, APP_VERSION);
  mountRoutes(api, defs, deps, getEm);

  const openapi = buildOpenApi(defs, APP_VERSION);
  api.get('/api/openapi.json', (_req, res) => {
    res.json(openapi);
  });
  api.use('/api/docs', swaggerUi.serve, swaggerUi.setup(openapi, { customSiteTitle: 'Splitcase API' }));
  api.use('/api', apiNotFound);
  app.use(api);

  if (options.webDist && existsSync(join(options.webDist, 'index.html'))) {
    const dist = options.webDist;
    app.use(express.static(dist, { index: false, maxAge: '1h' }));
    app.get('/{*splat}', (req, res, next) => {
      if (req.path.startsWith('/api/')) return next();
      res.setHeader('Cache-Control', 'no-cache');
      res.sendFile(join(dist, 'index.html'));
    });
  }

  app.use((_req, _res, next) => next(new AppError('not_found', 'Not found.')));
  app.use(errorHandler());
  return app;
}
