import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { freshDatabase, type TestDatabase } from '../support/test-db';
import { testApp } from '../support/test-app';

// A miniature export laid out as `expo export -p web` writes one (static output).
let web: string;
let t: TestDatabase;
beforeAll(async () => {
  t = await freshDatabase();
  web = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-web-'));
  const files: Record<string, string> = {
    'index.html': 'home',
    '+not-found.html': 'not found page',
    'district/[code].html': 'district template',
    'district/D07.html': 'district D07 prerendered',
    'method.html': 'method',
    '_expo/static/js/web/entry-abc.js': 'js',
    'assets/fonts/inter.woff2': 'font',
    'sw.js': 'self.addEventListener("fetch", () => {});',
  };
  for (const [f, body] of Object.entries(files)) {
    fs.mkdirSync(path.dirname(path.join(web, f)), { recursive: true });
    fs.writeFileSync(path.join(web, f), body);
  }
});
afterAll(async () => {
  fs.rmSync(web, { recursive: true, force: true });
  await t.drop();
});

describe('web build served from the API port', () => {
  const get = (p: string) => request(testApp(t.db, { webDir: web })).get(p);

  it.each([
    ['/', 200, 'home'],
    ['/district/D07', 200, 'district D07 prerendered'],
    ['/district/D12', 200, 'district template'],
    ['/method', 200, 'method'],
    ['/no/such/page', 404, 'not found page'],
    ['/district/D12/extra', 404, 'not found page'],
  ])('%s → %i %s', async (p, status, body) => {
    const res = await get(p);
    expect(res.status).toBe(status);
    expect(res.text).toBe(body);
  });

  it('serves hashed bundles as immutable and assets as files', async () => {
    const js = await get('/_expo/static/js/web/entry-abc.js');
    expect(js.status).toBe(200);
    expect(js.headers['cache-control']).toContain('immutable');
    expect((await get('/assets/fonts/inter.woff2')).status).toBe(200);
    expect((await get('/_expo/static/js/web/missing.js')).status).toBe(404);
  });

  it('serves the service worker never from a cache, as a script allowed by the CSP', async () => {
    const sw = await get('/sw.js');
    expect(sw.status).toBe(200);
    expect(sw.headers['cache-control']).toBe('no-cache');
    expect(sw.headers['content-type']).toMatch(/^text\/javascript/);
    expect(sw.headers['content-security-policy']).toMatch(/(^|;)\s*worker-src 'self'(;|$)/);
  });

  it('says plainly when the web app has not been built', async () => {
    const res = await request(testApp(t.db, { webDir: path.join(web, 'nothing-here') })).get('/');
    expect(res.status).toBe(503);
    expect(res.text).toMatch(/not been built/);
  });
});
