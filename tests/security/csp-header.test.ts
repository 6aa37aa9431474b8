/**
 * The Content-Security-Policy as served: no 'unsafe-inline' in script-src; the exported
 * pages' inline scripts are allowed by their SHA-256 (CSP Level 2 hash sources), read
 * from the web build's csp-hashes.json or computed from its HTML; with no web build at
 * all the server still starts and answers, with script-src 'self' only.
 */
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { CSP_HASHES_FILE, writeCspHashes } from '../../api/web/csp';
import { testApp } from '../support/test-app';
import { freshDatabase, type TestDatabase } from '../support/test-db';

let t: TestDatabase;
let dir: string;

// Two inline scripts as an exported page carries them, and one external script.
const BOOT = 'globalThis.__EXPO_ROUTER_HYDRATE__=true;';
const EARLY = '(function(){var p="/api/districts";fetch(p,{credentials:"same-origin"});})();';
const PAGE = `<!DOCTYPE html><html><head><script data-rh="true" >${EARLY}</script></head><body><script type="module">${BOOT}</script><script src="/_expo/static/js/web/entry.js" defer></script></body></html>`;
/** CSP Level 2 §4.2: 'sha256-' + base64 of the SHA-256 of the script's UTF-8 text (Node's crypto). */
const sha = (s: string) => `'sha256-${createHash('sha256').update(Buffer.from(s, 'utf8')).digest('base64')}'`;

function scriptSrc(header: string | undefined): string[] {
  const directive = (header ?? '')
    .split(';')
    .map((d) => d.trim())
    .find((d) => d.startsWith('script-src '));
  if (!directive) throw new Error(`no script-src in ${header}`);
  return directive.split(/\s+/).slice(1);
}

beforeAll(async () => {
  t = await freshDatabase();
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-csp-'));
});
afterAll(async () => {
  await t?.drop();
  if (dir) fs.rmSync(dir, { recursive: true, force: true });
});

async function headerFor(webDir: string) {
  const app = testApp(t.db, { webDir });
  try {
    const health = await request(app).get('/api/health');
    return { health, csp: health.headers['content-security-policy'] as string };
  } finally {
    await app.locals.close();
  }
}

it('lists the hash of every inline script of the build and no unsafe-inline', async () => {
  const web = path.join(dir, 'built');
  fs.mkdirSync(path.join(web, 'district'), { recursive: true });
  fs.writeFileSync(path.join(web, 'index.html'), PAGE);
  fs.writeFileSync(path.join(web, 'district', '[code].html'), PAGE.replace(EARLY, `${EARLY}/*card*/`));
  // As the web build does: the hashes file beside the HTML.
  expect(writeCspHashes(web).sort()).toEqual([sha(BOOT), sha(EARLY), sha(`${EARLY}/*card*/`)].sort());
  const { health, csp } = await headerFor(web);
  expect(health.status).toBe(200);
  const src = scriptSrc(csp);
  expect(src).not.toContain("'unsafe-inline'");
  expect(src.sort()).toEqual(["'self'", sha(BOOT), sha(EARLY), sha(`${EARLY}/*card*/`)].sort());
});

it('serves the hashes from csp-hashes.json when the build wrote one', async () => {
  const web = path.join(dir, 'from-file');
  fs.mkdirSync(web);
  fs.writeFileSync(path.join(web, 'index.html'), PAGE);
  const only = sha('console.log(1)');
  fs.writeFileSync(path.join(web, CSP_HASHES_FILE), JSON.stringify({ scriptSrc: [only] }));
  expect(scriptSrc((await headerFor(web)).csp)).toEqual(["'self'", only]);
});

it('computes them from the HTML for a build without the file', async () => {
  const web = path.join(dir, 'older');
  fs.mkdirSync(web);
  fs.writeFileSync(path.join(web, 'index.html'), PAGE);
  expect(scriptSrc((await headerFor(web)).csp).sort()).toEqual(["'self'", sha(BOOT), sha(EARLY)].sort());
});

it('starts and answers with no web build at all, allowing scripts from itself only', async () => {
  const { health, csp } = await headerFor(path.join(dir, 'absent'));
  expect(health.status).toBe(200);
  expect(scriptSrc(csp)).toEqual(["'self'"]);
  // The rest of the policy stays as it was (helmet defaults plus ours).
  expect(csp).toMatch(/default-src 'self'/);
  expect(csp).toMatch(/object-src 'none'/);
  expect(csp).toMatch(/frame-ancestors 'self'/);
});
