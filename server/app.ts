/** The Express application, built from its dependencies; `listen` lives in serve.ts. */
import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import compression from 'compression';
import cookieParser from 'cookie-parser';
import express, { type RequestHandler } from 'express';
import helmet from 'helmet';
import type { Logger } from 'pino';
import { pinoHttp } from 'pino-http';
import type mysql from 'mysql2/promise';
import { loadSession } from './auth/middleware.js';
import type { AppConfig } from './config.js';
import { databaseIsUp, type Database } from './db/client.js';
import { AppError, errorHandler, notFound } from './errors.js';
import type { Mailer } from './mail/mailer.js';
import { requestLogOptions } from './logger.js';
import { apiRoutes } from './routes/index.js';
import { refuseMalformedText } from './well-formed-text.js';

export interface AppDeps {
  db: Database;
  pool: mysql.Pool;
  config: AppConfig;
  logger: Logger;
  mailer: Mailer;
}

const STATE_CHANGING = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/**
 * Refuses state-changing requests sent by a browser from another site. Same-origin means the
 * Origin equals the configured app origin or the Host the request was sent to (which a page on
 * another site cannot forge). Clients that send no Origin (curl, server-to-server) pass.
 */
export function sameOriginOnly(appOrigin: string): RequestHandler {
  return (req, _res, next) => {
    if (!STATE_CHANGING.has(req.method)) return next();
    const origin = req.get('origin');
    const fetchSite = req.get('sec-fetch-site');
    if (fetchSite === 'cross-site') throw new AppError(403, 'cross_site', 'Cross-site requests are refused');
    if (!origin) return next();
    const host = req.get('host');
    let originHost: string | null = null;
    try {
      originHost = new URL(origin).host;
    } catch {
      originHost = null;
    }
    if (origin === appOrigin || (host && originHost === host)) return next();
    throw new AppError(403, 'cross_site', 'Cross-site requests are refused');
  };
}

export function createApp(deps: AppDeps): express.Express {
  const { config, logger, db } = deps;
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(
    helmet({
      // Served over plain http on loopback: no forced https, no HSTS.
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          'upgrade-insecure-requests': null,
          // Fonts and styles are shipped with the client: no https: loophole for outside ones.
          // PrimeVue writes its theme as inline <style> elements, hence 'unsafe-inline' for styles.
          'font-src': ["'self'", 'data:'],
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'worker-src': ["'self'", 'blob:'],
        },
      },
      strictTransportSecurity: false,
    }),
  );
  if (config.logLevel !== 'silent') app.use(pinoHttp(requestLogOptions(logger)));
  // gzip or brotli, as the client accepts: a scenario with its results is ~100 KB of JSON.
  app.use(compression());
  app.use(express.json({ limit: '1mb' }));
  app.use(refuseMalformedText);
  app.use(cookieParser());
  app.use('/api', sameOriginOnly(config.appOrigin));
  app.use(loadSession(db, config.jwtSecret));

  app.get('/api/health', async (_req, res) => {
    const up = await databaseIsUp(deps.pool);
    res.status(up ? 200 : 503).json({ status: up ? 'ok' : 'degraded', database: up ? 'up' : 'down' });
  });
  app.use('/api', apiRoutes(deps));
  app.use('/api', () => {
    throw notFound('No such API route');
  });

  const dist = resolve(config.distDir);
  if (existsSync(join(dist, 'index.html'))) {
    app.use(express.static(dist, { index: false, maxAge: '1h' }));
    // History fallback: every non-API path is a client route.
    app.get('/{*splat}', (_req, res) => res.sendFile(join(dist, 'index.html')));
  }
  app.use(errorHandler(logger));
  return app;
}
