/**
 * Sessions in PostgreSQL (express-session + connect-pg-simple): httpOnly, SameSite=Lax, a
 * fresh id at sign-in (passport regenerates it), destroyed at sign-out. In production the
 * cookie is `Secure` and carries the `__Host-` prefix (no Domain, Path=/), so a sibling
 * subdomain or a plain-http page cannot set or read it.
 *
 * Limits: a session unused for SESSION_IDLE_MINUTES ends (`idle`), and one older than
 * SESSION_MAX_HOURS ends whatever its use (`lifetime`); it keeps its `createdAt`. The row is
 * not rolled on every request: the store's touch is off, and the session records
 * `lastSeenAt` (and is so written back, with a fresh cookie expiry) at most once a minute.
 * An ended session forgets its person and CSRF token but remembers why it ended, so every
 * signed-in route answers 401 `session_expired` with `details.reason` until the person
 * signs in again.
 *
 * Reads: a session row read or written by this process is kept for at most
 * PERSON_CACHE_MS (api/people/session-person.ts), so a burst of requests reads it once.
 * Sign-out, sign-in and a change to the person through this process take effect at once;
 * a sign-out through another server process within that time, as a role change does.
 */
import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import type { ErrorRequestHandler, RequestHandler } from 'express';
import { Pool } from 'pg';
import type { Config } from '../config';
import type { AppContext } from '../context';
import { AppError } from '../http/errors';
import { cachedSession, forgetSession, keepSession } from '../people/session-person';

export type SessionEndReason = 'idle' | 'lifetime';

declare module 'express-session' {
  interface SessionData {
    csrfToken?: string;
    /** Sign-in time (ms since the epoch); the lifetime counts from here. */
    createdAt?: number;
    /** Last request that was written back (ms); at most a minute behind the real last one. */
    lastSeenAt?: number;
    /** Set when the session ended for a limit; cleared by signing in again (a new session). */
    endedReason?: SessionEndReason;
  }
}

/** How stale `lastSeenAt` may be before the session row is written back. */
export const WRITE_BACK_MS = 60_000;

/** The session cookie's name: `__Host-` prefixed in production, `cw.sid` in demo and test. */
export function sessionCookieName(config: Pick<Config, 'mode'>): string {
  return config.mode === 'production' ? '__Host-cw.sid' : 'cw.sid';
}

/** Options for clearing the cookie at sign-out (must match how it was set). */
export function sessionCookieOptions(config: Pick<Config, 'mode'>) {
  return { path: '/', httpOnly: true, sameSite: 'lax' as const, secure: config.mode === 'production' };
}

type Limits = Pick<Config, 'sessionIdleMinutes' | 'sessionMaxHours'>;

/**
 * Why a signed-in session has ended at `now`, or null while it is alive. When both limits
 * have passed, the one that passed first is named. A signed-in session without `createdAt`
 * (made before limits existed) counts as past its lifetime.
 */
export function sessionEnd(
  s: { createdAt?: number; lastSeenAt?: number },
  now: number,
  limits: Limits,
): SessionEndReason | null {
  if (typeof s.createdAt !== 'number') return 'lifetime';
  const lifetimeEnds = s.createdAt + limits.sessionMaxHours * 3_600_000;
  const idleEnds = (s.lastSeenAt ?? s.createdAt) + limits.sessionIdleMinutes * 60_000;
  if (now < lifetimeEnds && now < idleEnds) return null;
  return lifetimeEnds <= idleEnds ? 'lifetime' : 'idle';
}

/**
 * After the session middleware, before passport reads the person: ends a session past a
 * limit (forgets the person, keeps the reason), and moves `lastSeenAt` at most once a minute
 * (the only change that makes express-session write the row and re-send the cookie).
 */
export function sessionLimits(limits: Limits, now: () => number = Date.now): RequestHandler {
  return (req, _res, next) => {
    const s = req.session as (typeof req.session & { passport?: { user?: unknown } }) | undefined;
    if (!s || s.passport?.user === undefined) return next();
    const t = now();
    const ended = sessionEnd(s, t, limits);
    if (ended) {
      delete s.passport;
      delete s.csrfToken;
      s.endedReason = ended;
    } else if (t - (s.lastSeenAt ?? 0) >= WRITE_BACK_MS) {
      s.lastSeenAt = t;
    }
    next();
  };
}

/** Starts the limits' clock for a session that just signed in. */
export function startSessionClock(
  s: { createdAt?: number; lastSeenAt?: number; endedReason?: SessionEndReason },
  now = Date.now(),
): void {
  s.createdAt = now;
  s.lastSeenAt = now;
  delete s.endedReason;
}

/**
 * Turns the guard's plain 401 into `session_expired` with the reason when the caller's
 * session ended for a limit, so the app can say why the person must sign in again.
 */
export function sessionExpiredErrors(limits: Limits): ErrorRequestHandler {
  return (err, req, _res, next) => {
    const reason = (req as { session?: { endedReason?: SessionEndReason } }).session?.endedReason;
    if (err instanceof AppError && err.code === 'unauthenticated' && reason) {
      const message =
        reason === 'idle'
          ? `Your session ended after ${limits.sessionIdleMinutes} minutes without activity. Sign in again.`
          : `Sessions last at most ${limits.sessionMaxHours} hours. Sign in again.`;
      return next(new AppError(401, 'session_expired', message, { reason }));
    }
    next(err);
  };
}

export function sessionMiddleware({ config }: AppContext): { middleware: RequestHandler; close(): Promise<void> } {
  const PgStore = connectPgSimple(session);
  type Done = (err?: unknown) => void;
  class CachedPgStore extends PgStore {
    override get(sid: string, done: (err: unknown, sess?: session.SessionData | null) => void): void {
      const kept = cachedSession(sid);
      if (kept !== undefined) return done(null, kept as session.SessionData);
      super.get(sid, (err: unknown, sess?: session.SessionData | null) => {
        if (!err && sess) keepSession(sid, sess);
        done(err, sess);
      });
    }
    override set(sid: string, sess: session.SessionData, done?: Done): void {
      forgetSession(sid);
      super.set(sid, sess, (err?: unknown) => {
        if (!err) keepSession(sid, sess);
        done?.(err);
      });
    }
    override destroy(sid: string, done?: Done): void {
      forgetSession(sid);
      super.destroy(sid, done);
    }
  }
  // A small pool of its own; idle clients do not keep the process alive.
  const pool = new Pool({
    connectionString: config.databaseUrl,
    max: 4,
    idleTimeoutMillis: 5_000,
    allowExitOnIdle: true,
  });
  const store = new CachedPgStore({
    pool,
    tableName: 'session',
    createTableIfMissing: false,
    // No write per request: the row is saved only when the session changes (lastSeenAt moves once a minute).
    disableTouch: true,
    pruneSessionInterval: config.mode === 'test' ? false : 15 * 60,
  });
  const production = config.mode === 'production';
  const middleware = session({
    name: sessionCookieName(config),
    secret: config.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: false,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      path: '/',
      // Production only; whether the request came over https is Express's req.secure, which
      // honours X-Forwarded-Proto only from the proxies TRUST_PROXY names.
      secure: production,
      // The cookie and the row outlive the idle limit by the lifetime, so a person coming
      // back to an ended session is told why it ended (then the row is pruned).
      maxAge: (config.sessionIdleMinutes * 60 + config.sessionMaxHours * 3600) * 1000,
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
