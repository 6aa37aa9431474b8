/**
 * Builds the Express app (no listen): security headers, request log, sessions and
 * sign-in, the JSON API under /api from the route table, and the exported web build on
 * every other path. Tests import this.
 */
import express, { type Express } from 'express';
import compression from 'compression';
import helmet from 'helmet';
import type { Knex } from 'knex';
import morgan from 'morgan';
import { createPassport } from './auth/passport';
import { publishedMayHaveChanged } from './estimates/published-cache';
import { sessionExpiredErrors, sessionLimits, sessionMiddleware } from './auth/session';
import { createComputePool, type ComputePool } from './compute/pool';
import type { Config } from './config';
import type { AppContext } from './context';
import { apiNotFound, errorMiddleware } from './http/error-middleware';
import { redactUrl } from './http/redact-url';
import { mountRoutes, type RouteSpec } from './http/routes';
import type { Jobs } from './jobs/boss';
import { createMailer, type Mailer } from './mail/mailer';
import { routeTable } from './routes';
import { loadCspHashes } from './web/csp';
import { webRouter } from './web/static-routes';

export interface AppDeps {
  db: Knex;
  config: Config;
  log?: (msg: string) => void;
  mailer?: Mailer;
  jobs?: Jobs | null;
  /** A pool to share (e.g. with the job handlers); by default the app makes and closes its own. */
  compute?: ComputePool;
}

export interface CrestwatchApp extends Express {
  locals: Express['locals'] & { routes: RouteSpec[]; ctx: AppContext; close(): Promise<void> };
}

export function createApp({
  db,
  config,
  log = (m) => process.stderr.write(`${m}\n`),
  mailer,
  jobs = null,
  compute,
}: AppDeps): CrestwatchApp {
  const app = express() as CrestwatchApp;
  const ownPool = compute === undefined;
  const ctx: AppContext = {
    db,
    config,
    log,
    mailer: mailer ?? createMailer(config),
    jobs,
    compute: compute ?? createComputePool(config.computePoolSize),
  };
  app.disable('x-powered-by');
  // TRUST_PROXY: whose X-Forwarded-For / -Proto to believe (req.ip for rate limits, req.secure for the cookie).
  app.set('trust proxy', config.trustProxy);
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          // The exported pages' few inline scripts are allowed by their hashes, computed at
          // web-build time (api/web/csp.ts); no 'unsafe-inline' for scripts.
          'script-src': ["'self'", ...loadCspHashes(config.webDir)],
          // React Native Web writes its styles into style tags at run time.
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'font-src': ["'self'", 'data:'],
          'connect-src': ["'self'"],
          // The service worker (dist/sw.js, offline reading) comes from the app itself.
          'worker-src': ["'self'"],
          'form-action': [
            "'self'",
            ...(config.mode === 'production'
              ? ['https://accounts.google.com']
              : [`http://127.0.0.1:${config.standInPort}`]),
          ],
          'upgrade-insecure-requests': null,
        },
      },
    }),
  );
  // Answers above 1 KB are compressed (brotli where the client accepts it, else gzip): the
  // region and district list of a large region shrink about tenfold.
  app.use(compression({ threshold: 1024 }));
  if (config.logRequests) {
    // The path as sent, with the values of token, code and state redacted.
    morgan.token('safe-url', (req) => redactUrl((req as { originalUrl?: string }).originalUrl ?? req.url ?? ''));
    app.use(
      morgan(':method :safe-url :status :res[content-length] - :response-time ms', {
        stream: { write: (l) => log(l.trimEnd()) },
      }),
    );
  }
  const sessions = sessionMiddleware(ctx);
  const passport = createPassport(ctx);
  app.use('/api', express.json({ limit: '2mb' }), express.urlencoded({ extended: false, limit: '64kb' }));
  app.use('/api', sessions.middleware, sessionLimits(config), passport.session());
  // A state-changing request has committed what it changed by the time it answers: the
  // published answers' kept version is read again (api/estimates/published-cache.ts).
  app.use('/api', (req, res, next) => {
    if (req.method === 'GET' || req.method === 'HEAD' || req.method === 'OPTIONS') return next();
    const end = res.end.bind(res) as (...args: unknown[]) => typeof res;
    res.end = ((...args: unknown[]) => {
      publishedMayHaveChanged(ctx.db);
      return end(...args);
    }) as typeof res.end;
    next();
  });
  const routes = routeTable(ctx, passport);
  const api = express.Router();
  mountRoutes(api, routes, { compute: { perMinute: config.computeRequestsPerMinute } });
  app.use(api);
  app.use('/api', apiNotFound);
  app.use('/api', sessionExpiredErrors(config));
  app.use(webRouter(config.webDir));
  app.use(errorMiddleware(log));
  app.locals.routes = routes;
  app.locals.ctx = ctx;
  app.locals.close = async () => {
    await sessions.close();
    ctx.mailer.close();
    if (ownPool) await ctx.compute.close();
  };
  return app;
}
