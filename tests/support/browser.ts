/**
 * Browser-test harness: the real app (API + exported web build) on a loopback port over a
 * fresh seeded database, and Debian's Chromium driven by playwright-core. Every request
 * the page makes is recorded so a test can check none leaves 127.0.0.1, and every page
 * listens for `securitypolicyviolation`: any Content-Security-Policy violation on any page
 * a test visits fails that test file when the harness closes.
 */
import fs from 'node:fs';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { seedDemoIfEmpty } from '../../api/demo/seed';
import { listenOn } from '../../api/http/listen';
import { ensureDemoAccounts } from '../../api/people/service';
import type { Jobs } from '../../api/jobs/boss';
import { loadConfig } from '../../api/config';
import { startMailCatcher, type MailCatcher } from '../../api/mail/catcher';
import { createMailer } from '../../api/mail/mailer';
import { testJobs, workIn } from './jobs';
import { publishDefaultRun } from './published-run';
import { testApp } from './test-app';
import { freshDatabase, type TestDatabase } from './test-db';

export const root = path.resolve(__dirname, '..', '..');
export const artifactsDir = path.join(root, 'tests', 'artifacts', 'screenshots');
export const webDir = path.join(root, 'dist');

export const VIEWPORTS = {
  phone: { width: 390, height: 844 },
  laptop: { width: 1280, height: 800 },
  wide: { width: 1440, height: 900 },
} as const;

export interface Harness {
  baseUrl: string;
  browser: Browser;
  t: TestDatabase;
  requests: string[];
  /** CSP violations seen on any page so far ("<directive> blocked <uri> on <page>"). */
  cspViolations: string[];
  /** `touch`: the page has a touch screen (touch events, page.touchscreen, CDP Input.dispatchTouchEvent). */
  newPage(
    viewport: { width: number; height: number },
    options?: { touch?: boolean },
  ): Promise<{ context: BrowserContext; page: Page }>;
  shot(page: Page, name: string): Promise<string>;
  close(): Promise<void>;
}

export interface HarnessOptions {
  /** Run the default spec over the seeded districts and publish it before the browser starts. */
  publishRun?: boolean;
  /** Keep pg-boss workers running in this process, so runs started from the app complete. */
  jobs?: boolean;
  /** Send mail through the local catcher (it stores each message where the mailbox screen reads it). */
  mailCatcher?: boolean;
}

export async function startHarness(options: HarnessOptions = {}): Promise<Harness> {
  if (!fs.existsSync(path.join(webDir, 'index.html'))) {
    throw new Error('dist/ has no web build: run `npm test` (it builds) or `npm run build:web` first');
  }
  const t = await freshDatabase();
  await seedDemoIfEmpty(t.db);
  await ensureDemoAccounts(t.db);
  const catcher: MailCatcher | null = options.mailCatcher ? await startMailCatcher(t.db, 0) : null;
  const app = catcher
    ? testApp(
        t.db,
        { webDir, mailCatcherPort: catcher.port },
        createMailer({ ...loadConfig({ CRESTWATCH_MODE: 'test' }), mailCatcherPort: catcher.port }),
      )
    : testApp(t.db, { webDir });
  if (options.publishRun) await publishDefaultRun(app, t.url);
  let jobs: Jobs | null = null;
  if (options.jobs) {
    jobs = await testJobs(t.url);
    app.locals.ctx.jobs = jobs;
    await workIn(app.locals.ctx, jobs);
  }
  const server: Server = await listenOn(app, 0);
  const baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  // playwright gives each launch a fresh, empty profile directory of its own.
  const browser = await chromium
    .launch({
      executablePath: '/usr/bin/chromium',
      headless: true,
      args: [
        '--no-sandbox',
        '--disable-gpu',
        '--disable-quic',
        '--no-first-run',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
      ],
    })
    .catch(async (err: Error) => {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await jobs?.stop();
      await app.locals.close();
      await catcher?.stop();
      await t.drop();
      throw err;
    });
  fs.mkdirSync(artifactsDir, { recursive: true });
  const requests: string[] = [];
  const cspViolations: string[] = [];
  return {
    baseUrl,
    browser,
    t,
    requests,
    cspViolations,
    async newPage(viewport, options = {}) {
      const context = await browser.newContext({ viewport, deviceScaleFactor: 1, hasTouch: options.touch ?? false });
      // Runs in every page of the context before its own scripts (not subject to the CSP).
      await context.exposeBinding('__cwCspViolation', (_source, text: string) => {
        cspViolations.push(text);
      });
      await context.addInitScript(() => {
        document.addEventListener('securitypolicyviolation', (e) => {
          const report = (window as unknown as { __cwCspViolation(t: string): void }).__cwCspViolation;
          report(
            `${e.effectiveDirective} blocked ${e.blockedURI || '(inline)'} on ${e.documentURI}${e.sample ? ` (${e.sample})` : ''}`,
          );
        });
      });
      const page = await context.newPage();
      page.on('request', (req) => requests.push(req.url()));
      return { context, page };
    },
    async shot(page, name) {
      const file = path.join(artifactsDir, `${name}.png`);
      await page.screenshot({ path: file, fullPage: false });
      return file;
    },
    async close() {
      await browser.close();
      await new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      });
      await jobs?.stop();
      await app.locals.close();
      await catcher?.stop();
      await t.drop();
      if (cspViolations.length) throw new Error(`Content-Security-Policy violations:\n${cspViolations.join('\n')}`);
    },
  };
}

/** Requests that went anywhere but the loopback server (data: and blob: URLs are local). */
export function offLoopback(requests: string[]): string[] {
  // An empty capture would make every "no request beyond loopback" check pass vacuously.
  if (requests.length === 0) throw new Error('no request was captured: the request listener is not working');
  return requests.filter((u) => !/^(data:|blob:|http:\/\/127\.0\.0\.1:\d+\/)/.test(u));
}
