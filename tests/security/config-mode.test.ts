/**
 * Item 8 of the hardening issue: the server fails closed. NODE_ENV=production refuses any
 * other CRESTWATCH_MODE and a SESSION_SECRET under 32 bytes; with nothing set it runs the
 * demo and says so in its first log line.
 */
import { spawn } from 'node:child_process';
import path from 'node:path';
import { loadConfig, MIN_SESSION_SECRET_BYTES } from '../../api/config';

jest.setTimeout(60_000);

const root = path.resolve(__dirname, '..', '..');
const PRODUCTION = {
  NODE_ENV: 'production',
  DATABASE_URL: 'postgres://crestwatch@db.internal/crestwatch',
  GOOGLE_CLIENT_ID: 'client',
  GOOGLE_CLIENT_SECRET: 'secret',
  SESSION_SECRET: 'x'.repeat(32),
};

describe('loadConfig', () => {
  it('refuses NODE_ENV=production with another CRESTWATCH_MODE', () => {
    expect(() => loadConfig({ ...PRODUCTION, CRESTWATCH_MODE: 'demo' })).toThrow(
      /NODE_ENV=production refuses CRESTWATCH_MODE=demo/,
    );
    expect(() => loadConfig({ ...PRODUCTION, CRESTWATCH_MODE: 'test' })).toThrow(/refuses CRESTWATCH_MODE=test/);
    expect(loadConfig({ ...PRODUCTION, CRESTWATCH_MODE: 'production' }).mode).toBe('production');
    expect(loadConfig(PRODUCTION).mode).toBe('production');
  });

  it('refuses a session secret under 32 bytes in production, counting bytes, not characters', () => {
    // 32 bytes: the floor (256 bits, common practice for an HMAC key).
    expect(MIN_SESSION_SECRET_BYTES).toBe(32);
    expect(() => loadConfig({ ...PRODUCTION, SESSION_SECRET: 'x'.repeat(31) })).toThrow(/at least 32 bytes.*got 31/);
    expect(() => loadConfig({ ...PRODUCTION, SESSION_SECRET: undefined })).toThrow(/SESSION_SECRET is required/);
    // 16 × "é" is 16 characters but 32 bytes of UTF-8.
    expect(loadConfig({ ...PRODUCTION, SESSION_SECRET: 'é'.repeat(16) }).sessionSecret).toBe('é'.repeat(16));
    expect(() =>
      loadConfig({
        CRESTWATCH_MODE: 'production',
        DATABASE_URL: 'postgres://x',
        GOOGLE_CLIENT_ID: 'a',
        GOOGLE_CLIENT_SECRET: 'b',
        SESSION_SECRET: 'short',
      }),
    ).toThrow(/at least 32 bytes/);
  });

  it('runs the demo when nothing is set, and says so; not when a mode was chosen', () => {
    const demo = loadConfig({});
    expect(demo.mode).toBe('demo');
    expect(demo.modeNotice).toMatch(/runs the DEMO/);
    expect(loadConfig({ CRESTWATCH_MODE: 'demo' }).modeNotice).toBeNull();
    expect(loadConfig(PRODUCTION).modeNotice).toBeNull();
  });
});

/** Runs `npm run serve`'s entry with exactly this environment; resolves with its output. */
function serve(env: Record<string, string>): Promise<{ code: number | null; stdout: string; stderr: string }> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, ['--import', 'tsx', path.join(root, 'api', 'server.ts')], {
      cwd: root,
      env: { PATH: process.env.PATH ?? '', HOME: process.env.HOME ?? '', ...env },
    });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (d) => (stdout += d));
    child.stderr.on('data', (d) => (stderr += d));
    const timer = setTimeout(() => child.kill('SIGTERM'), 40_000);
    child.on('exit', (code) => {
      clearTimeout(timer);
      resolve({ code, stdout, stderr });
    });
  });
}

describe('the server process', () => {
  it('says it runs the demo in its first log line when nothing is set', async () => {
    // Port 1 answers nobody, so the start fails right after the first line.
    const r = await serve({ DATABASE_URL: 'postgres://postgres@127.0.0.1:1/none', PORT: '1' });
    expect(r.stdout.split('\n')[0]).toMatch(/^Crestwatch runs the DEMO/);
    expect(r.code).toBe(1);
  });

  it('refuses to start with NODE_ENV=production and CRESTWATCH_MODE=demo', async () => {
    const r = await serve({ ...PRODUCTION, CRESTWATCH_MODE: 'demo' });
    expect(r.code).toBe(1);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(/could not start: NODE_ENV=production refuses CRESTWATCH_MODE=demo/);
  });
});
