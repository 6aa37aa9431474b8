import path from 'node:path';

/**
 * Every setting the server reads from the environment, in one place, with defaults that
 * run the demo on loopback.
 */
export const DEMO_DB_PORT = 54329;
export const TEST_DB_PORT = 54339;

export type Mode = 'demo' | 'test' | 'production';

export interface Config {
  mode: Mode;
  host: string;
  port: number;
  databaseUrl: string;
  /** Where the exported web build lives (served from the same port as the API). */
  webDir: string;
  logRequests: boolean;
}

function intFrom(name: string, fallback: number): number {
  const raw = process.env[name];
  if (raw === undefined || raw === '') return fallback;
  const n = Number(raw);
  if (!Number.isInteger(n) || n <= 0) throw new Error(`${name} must be a positive integer, got "${raw}"`);
  return n;
}

export function demoDatabaseUrl(port = DEMO_DB_PORT, db = 'crestwatch'): string {
  return `postgres://postgres@127.0.0.1:${port}/${db}`;
}

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const mode = (env.CRESTWATCH_MODE ?? (env.NODE_ENV === 'production' ? 'production' : 'demo')) as Mode;
  if (!['demo', 'test', 'production'].includes(mode)) {
    throw new Error(`CRESTWATCH_MODE must be demo, test or production, got "${mode}"`);
  }
  if (mode === 'production' && !env.DATABASE_URL) {
    throw new Error('DATABASE_URL is required in production mode');
  }
  return {
    mode,
    host: env.HOST ?? '127.0.0.1',
    port: intFrom('PORT', 8080),
    databaseUrl: env.DATABASE_URL ?? demoDatabaseUrl(),
    webDir: env.WEB_DIR ?? path.resolve(__dirname, '..', 'dist'),
    logRequests: env.LOG_REQUESTS !== '0' && mode !== 'test',
  };
}
