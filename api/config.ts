import { isIP } from 'node:net';
import os from 'node:os';
import { COMPUTE_LIMIT } from './http/rate-limit';
import path from 'node:path';

/**
 * Every setting the server reads from the environment, in one place, with defaults that
 * run the demo on loopback.
 */
export const DEMO_DB_PORT = 54329;
/** The test cluster's port; CRESTWATCH_TEST_DB_PORT moves it so two checkouts can test side by side. */
export const TEST_DB_PORT = Number(process.env.CRESTWATCH_TEST_DB_PORT) || 54339;
/** The test suite's OAuth stand-in (started once by jest's global setup); CRESTWATCH_TEST_STAND_IN_PORT moves it. */
export const TEST_STAND_IN_PORT = Number(process.env.CRESTWATCH_TEST_STAND_IN_PORT) || 54349;

export type Mode = 'demo' | 'test' | 'production';

export interface OAuthConfig {
  clientId: string;
  clientSecret: string;
  authorizationURL: string;
  tokenURL: string;
  userProfileURL: string;
  /** Relative paths resolve against the request's own origin. */
  callbackURL: string;
}

export interface Config {
  mode: Mode;
  host: string;
  port: number;
  /** Public origin used in e-mailed links. */
  publicUrl: string;
  databaseUrl: string;
  /** Where the exported web build lives (served from the same port as the API). */
  webDir: string;
  logRequests: boolean;
  sessionSecret: string;
  /** A session unused this long ends (401 `session_expired`, reason `idle`). */
  sessionIdleMinutes: number;
  /** A session older than this ends whatever its use (reason `lifetime`). */
  sessionMaxHours: number;
  /** Express's `trust proxy`: a hop count, or addresses / subnets / named ranges of trusted proxies. */
  trustProxy: number | string[];
  /** When set, only Google accounts of this Workspace domain (userinfo `hd`) may sign in. */
  googleHostedDomain: string | null;
  /** Said in the server's first log line when the mode was not chosen explicitly (null otherwise). */
  modeNotice: string | null;
  /** Sign-in attempts per IP and minute on /api/auth/*. */
  authRateLimitPerMinute: number;
  oauth: OAuthConfig;
  /** Demo and test: port of the local OAuth stand-in (null in production). */
  standInPort: number | null;
  /** SMTP server for outgoing mail; null means the local catcher (demo and test). */
  smtpUrl: string | null;
  /** Port of the local mail catcher in demo mode. */
  mailCatcherPort: number;
  mailFrom: string;
  /** E-mail of the first admin, created at start when the database has no admin. */
  firstAdminEmail: string | null;
  /** Maximum upload size in bytes. */
  uploadMaxBytes: number;
  /** New district codes one upload may bring; one more stops the read (keeps a file of distinct codes from filling memory). */
  uploadMaxNewDistricts: number;
  /** Largest boundary (GeoJSON) file accepted, in bytes. */
  boundaryMaxBytes: number;
  /** Most vertices one district's boundary may have. */
  boundaryMaxVertices: number;
  /** Seconds before a job whose worker died is retried elsewhere. */
  jobExpireSeconds: number;
  /** Worker polling interval in seconds (pg-boss's floor is 0.5). */
  jobPollSeconds: number;
  /** pg-boss maintenance interval (expiry of lost jobs) in seconds. */
  jobMaintenanceSeconds: number;
  /** Districts per run chunk (one job each). */
  runChunkSize: number;
  /** Seconds before the first retry of an e-mail that could not be sent (doubles each time). */
  mailRetrySeconds: number;
  /** Worker threads for fits and PDFs (api/compute/pool.ts); 0 runs them on the main thread. */
  computePoolSize: number;
  /** Heavy requests (the route table's 'compute' bucket) a person may start in one minute. */
  computeRequestsPerMinute: number;
}

/** Default pool size: every core but the one the event loop needs, at least one. */
function defaultPoolSize(): number {
  return Math.max(1, os.availableParallelism() - 1);
}

function intFrom(env: NodeJS.ProcessEnv, name: string, fallback: number): number {
  const raw = env[name];
  if (raw === undefined || raw === '') return fallback;
  const n = Number(raw);
  if (!Number.isInteger(n) || n <= 0) throw new Error(`${name} must be a positive integer, got "${raw}"`);
  return n;
}

/** Named ranges Express understands in `trust proxy` besides addresses and subnets. */
const NAMED_RANGES = new Set(['loopback', 'linklocal', 'uniquelocal']);

/**
 * TRUST_PROXY: a hop count (`1` behind one load balancer) or a comma-separated list of
 * addresses, CIDR subnets or the named ranges loopback / linklocal / uniquelocal. `true`
 * (trust every hop) is refused: anyone could then choose their own address.
 */
export function parseTrustProxy(raw: string | undefined): number | string[] {
  if (raw === undefined || raw.trim() === '') return ['loopback'];
  const text = raw.trim();
  if (/^\d+$/.test(text)) return Number(text);
  if (text === 'true')
    throw new Error(
      "TRUST_PROXY=true would trust any client's X-Forwarded-For; give the hop count (e.g. 1) or the proxies' addresses",
    );
  const items = text.split(',').map((x) => x.trim());
  for (const item of items) {
    const [addr, bits, extra] = item.split('/');
    const ok =
      NAMED_RANGES.has(item) ||
      (extra === undefined && isIP(addr) !== 0 && (bits === undefined || /^\d{1,3}$/.test(bits)));
    if (!ok)
      throw new Error(
        `TRUST_PROXY: "${item}" is not a hop count, an address, a subnet (a.b.c.d/n) or loopback / linklocal / uniquelocal`,
      );
  }
  return items;
}

/** Smallest SESSION_SECRET accepted in production, in bytes (UTF-8). */
export const MIN_SESSION_SECRET_BYTES = 32;

export function demoDatabaseUrl(port = DEMO_DB_PORT, db = 'crestwatch'): string {
  return `postgres://postgres@127.0.0.1:${port}/${db}`;
}

function oauthConfig(env: NodeJS.ProcessEnv, mode: Mode, standInPort: number | null): OAuthConfig {
  if (mode === 'production') {
    const missing = ['GOOGLE_CLIENT_ID', 'GOOGLE_CLIENT_SECRET'].filter((k) => !env[k]);
    if (missing.length) throw new Error(`production mode needs ${missing.join(' and ')}`);
    return {
      clientId: env.GOOGLE_CLIENT_ID!,
      clientSecret: env.GOOGLE_CLIENT_SECRET!,
      authorizationURL: env.GOOGLE_AUTHORIZATION_URL ?? 'https://accounts.google.com/o/oauth2/v2/auth',
      tokenURL: env.GOOGLE_TOKEN_URL ?? 'https://www.googleapis.com/oauth2/v4/token',
      userProfileURL: env.GOOGLE_USERINFO_URL ?? 'https://www.googleapis.com/oauth2/v3/userinfo',
      callbackURL: env.GOOGLE_CALLBACK_URL ?? '/api/auth/google/callback',
    };
  }
  const base = `http://127.0.0.1:${standInPort}`;
  return {
    clientId: 'crestwatch-local',
    clientSecret: 'crestwatch-local-secret',
    authorizationURL: `${base}/authorize`,
    tokenURL: `${base}/token`,
    userProfileURL: `${base}/userinfo`,
    callbackURL: '/api/auth/google/callback',
  };
}

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const productionEnv = env.NODE_ENV === 'production';
  if (productionEnv && env.CRESTWATCH_MODE !== undefined && env.CRESTWATCH_MODE !== 'production') {
    throw new Error(
      `NODE_ENV=production refuses CRESTWATCH_MODE=${env.CRESTWATCH_MODE}: unset it or set it to production`,
    );
  }
  const mode = (env.CRESTWATCH_MODE ?? (productionEnv ? 'production' : 'demo')) as Mode;
  if (!['demo', 'test', 'production'].includes(mode)) {
    throw new Error(`CRESTWATCH_MODE must be demo, test or production, got "${mode}"`);
  }
  if (mode === 'production' && !env.DATABASE_URL) throw new Error('DATABASE_URL is required in production mode');
  if (mode === 'production' && !env.SESSION_SECRET) throw new Error('SESSION_SECRET is required in production mode');
  if (mode === 'production' && Buffer.byteLength(env.SESSION_SECRET!, 'utf8') < MIN_SESSION_SECRET_BYTES) {
    throw new Error(
      `SESSION_SECRET must be at least ${MIN_SESSION_SECRET_BYTES} bytes in production mode, got ${Buffer.byteLength(env.SESSION_SECRET!, 'utf8')} (e.g. openssl rand -base64 48)`,
    );
  }
  const modeNotice =
    env.CRESTWATCH_MODE === undefined && !productionEnv
      ? 'Crestwatch runs the DEMO (neither NODE_ENV=production nor CRESTWATCH_MODE is set): invented data, the sign-in stand-in and a public session secret. Set NODE_ENV=production for a real deployment.'
      : null;
  const host = env.HOST ?? '127.0.0.1';
  const port = intFrom(env, 'PORT', 8080);
  const standInPort =
    mode === 'production' ? null : intFrom(env, 'OAUTH_STAND_IN_PORT', mode === 'test' ? TEST_STAND_IN_PORT : 8079);
  return {
    mode,
    host,
    port,
    publicUrl: env.PUBLIC_URL ?? `http://${host}:${port}`,
    databaseUrl: env.DATABASE_URL ?? demoDatabaseUrl(),
    webDir: env.WEB_DIR ?? path.resolve(__dirname, '..', 'dist'),
    logRequests: env.LOG_REQUESTS !== '0' && mode !== 'test',
    sessionSecret: env.SESSION_SECRET ?? 'crestwatch-local-only-secret',
    sessionIdleMinutes: intFrom(env, 'SESSION_IDLE_MINUTES', 30),
    sessionMaxHours: intFrom(env, 'SESSION_MAX_HOURS', 12),
    trustProxy: parseTrustProxy(env.TRUST_PROXY),
    googleHostedDomain: env.GOOGLE_HOSTED_DOMAIN?.trim().toLowerCase() || null,
    modeNotice,
    authRateLimitPerMinute: intFrom(env, 'AUTH_RATE_LIMIT_PER_MINUTE', 60),
    oauth: oauthConfig(env, mode, standInPort),
    standInPort,
    smtpUrl: env.SMTP_URL ?? null,
    mailCatcherPort: intFrom(env, 'MAIL_CATCHER_PORT', 2525),
    mailFrom: env.MAIL_FROM ?? 'Crestwatch <no-reply@crestwatch.example>',
    firstAdminEmail: env.CRESTWATCH_FIRST_ADMIN ?? (mode === 'production' ? null : 'admin@crestwatch.example'),
    uploadMaxBytes: intFrom(env, 'UPLOAD_MAX_BYTES', 50 * 1024 * 1024),
    uploadMaxNewDistricts: intFrom(env, 'UPLOAD_MAX_NEW_DISTRICTS', 50_000),
    boundaryMaxBytes: intFrom(env, 'BOUNDARY_MAX_BYTES', 50 * 1024 * 1024),
    boundaryMaxVertices: intFrom(env, 'BOUNDARY_MAX_VERTICES', 100_000),
    jobExpireSeconds: intFrom(env, 'JOB_EXPIRE_SECONDS', 300),
    jobPollSeconds: Math.max(0.5, Number(env.JOB_POLL_SECONDS ?? 0.5)),
    jobMaintenanceSeconds: intFrom(env, 'JOB_MAINTENANCE_SECONDS', 30),
    runChunkSize: intFrom(env, 'RUN_CHUNK_SIZE', 250),
    mailRetrySeconds: intFrom(env, 'MAIL_RETRY_SECONDS', 30),
    computePoolSize: env.COMPUTE_POOL_SIZE === '0' ? 0 : intFrom(env, 'COMPUTE_POOL_SIZE', defaultPoolSize()),
    computeRequestsPerMinute: intFrom(env, 'COMPUTE_RATE_LIMIT_PER_MINUTE', COMPUTE_LIMIT.perMinute),
  };
}
