/**
 * Builds the Express app (no listen): security headers, request log, JSON API under
 * /api, the exported web build on every other path. Tests import this.
 */
import express, { type Express } from 'express';
import helmet from 'helmet';
import type { Knex } from 'knex';
import morgan from 'morgan';
import type { Config } from './config';
import type { AppContext } from './context';
import { apiNotFound, errorMiddleware } from './http/error-middleware';
import { mountRoutes } from './http/routes';
import { routeTable } from './routes';
import { webRouter } from './web/static-routes';

export interface AppDeps {
  db: Knex;
  config: Config;
  log?: (msg: string) => void;
}

export function createApp({ db, config, log = (m) => process.stderr.write(`${m}\n`) }: AppDeps): Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          // Expo's static pages inline a small bootstrap script and style tags.
          'script-src': ["'self'", "'unsafe-inline'"],
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'font-src': ["'self'", 'data:'],
          'connect-src': ["'self'"],
          'upgrade-insecure-requests': null,
        },
      },
    }),
  );
  if (config.logRequests) {
    app.use(morgan(':method :url :status :res[content-length] - :response-time ms', { stream: { write: (l) => log(l.trimEnd()) } }));
  }
  const ctx: AppContext = { db, config, log };
  app.use('/api', express.json({ limit: '2mb' }));
  const api = express.Router();
  mountRoutes(api, routeTable(ctx));
  app.use(api);
  app.use('/api', apiNotFound);
  app.use(webRouter(config.webDir));
  app.use(errorMiddleware(log));
  return app;
}
