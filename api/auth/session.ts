/**
 * Sessions in PostgreSQL (express-session + connect-pg-simple): httpOnly, SameSite=Lax,
 * Secure when the request came over https, an idle timeout (rolling), a fresh id at
 * sign-in (passport regenerates it), destroyed at sign-out.
 */
import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import type { RequestHandler } from 'express';
import { Pool } from 'pg';
import type { AppContext } from '../context';

declare module 'express-session' {
  interface SessionData {
    csrfToken?: string;
  }
}

export const SESSION_COOKIE = 'cw.sid';

export function sessionMiddleware({ config }: AppContext): { middleware: RequestHandler; close(): Promise<void> } {
  const PgStore = connectPgSimple(session);
  // A small pool of its own; idle clients do not keep the process alive.
  const pool = new Pool({ connectionString: config.databaseUrl, max: 4, idleTimeoutMillis: 5_000, allowExitOnIdle: true });
  const store = new PgStore({
    pool,
    tableName: 'session',
    createTableIfMissing: false,
    pruneSessionInterval: config.mode === 'test' ? false : 15 * 60,
  });
  const middleware = session({
    name: SESSION_COOKIE,
    secret: config.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    proxy: true,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: 'auto',
      maxAge: config.sessionIdleMinutes * 60 * 1000,
    },
  });
  return {
    middleware,
    async close() {
      store.close();
      await pool.end().catch(() => {});
    },
  };
}
